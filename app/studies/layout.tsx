
export default function StudiesLayout({ children }: { children: React.ReactNode }) {
  return children;
}
