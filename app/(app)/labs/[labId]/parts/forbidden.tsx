import { Refusal } from "@/components/shell/refusal";

export default function Forbidden() {
  return <Refusal message="Only the course staff see the bench parts list." />;
}
