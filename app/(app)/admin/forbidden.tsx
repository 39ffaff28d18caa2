import { Refusal } from "@/components/shell/refusal";

export default function Forbidden() {
  return <Refusal message="Only a site administrator can open this page." hint="Your courses are on the home page." />;
}
