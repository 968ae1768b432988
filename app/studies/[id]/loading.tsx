import { LoadingState } from "../_components/Loading";

export default function Loading() {
  return <LoadingState what="Evaluating the scenarios: efficiency, flame temperatures, costs and fit checks…" />;
}
