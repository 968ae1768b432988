import { LoadingState } from "../../_components/Loading";

export default function Loading() {
  return <LoadingState what="Preparing the report: evaluation, sweep and sources…" />;
}
