import { json, route } from "@/lib/http/route";
import { requireUser } from "@/lib/auth/access";
import { libraryJson } from "@/lib/instruments/service";

export const GET = route(async () => {
  await requireUser();
  return json(libraryJson());
});
