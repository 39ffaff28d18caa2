import { Refusal } from "@/components/shell/refusal";

// A course page whose role the member lacks (403); pages below with their own forbidden.tsx say more.
export default function Forbidden() {
  return <Refusal message="Only the course staff can see this." />;
}
