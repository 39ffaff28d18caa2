import { json, jsonBody, route } from "@/lib/http/route";
import { instrumentWithAccess, patchInstrument, removeInstrument } from "@/lib/instruments/service";
import { instrumentPatchSchema } from "@/lib/validation/instruments";

type Params = { instrumentId: string };

export const PATCH = route<Params>(async (req, { instrumentId }) => {
  await instrumentWithAccess(instrumentId, ["instructor"]);
  const patch = await jsonBody(req, instrumentPatchSchema);
  return json({ instrument: await patchInstrument(instrumentId, patch) });
});

export const DELETE = route<Params>(async (_req, { instrumentId }) => {
  await instrumentWithAccess(instrumentId, ["instructor"]);
  await removeInstrument(instrumentId);
  return json({ deleted: true });
});
