import { LoadingState } from "../../_components/Loading";

export default function Loading() {
  return <LoadingState what="Computing the sensitivity of the ranking metric…" />;
}
