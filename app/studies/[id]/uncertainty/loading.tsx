import { LoadingState } from "../../_components/Loading";

export default function Loading() {
  return <LoadingState what="Running the Monte Carlo draws (each one through the plant model's efficiencies and the price paths)…" />;
}
