import { LoadingState } from "../../_components/Loading";

export default function Loading() {
  return <LoadingState what="Solving the flame temperature over the equivalence ratio (equilibrium and complete combustion)…" />;
}
