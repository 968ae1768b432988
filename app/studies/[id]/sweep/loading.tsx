import { LoadingState } from "../../_components/Loading";

export default function Loading() {
  return <LoadingState what="Computing the hydrogen-share sweep (0–100 vol %, one equilibrium flame temperature per step)…" />;
}
