import "../studies/decision.css";

export default function PlantsLayout({ children }: { children: React.ReactNode }) {
  return children;
}
