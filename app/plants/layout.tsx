
export default function PlantsLayout({ children }: { children: React.ReactNode }) {
  return children;
}
