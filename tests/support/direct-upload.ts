// Sending the parts of an upload straight to the object-store stand-in, as a browser's upload client
// does: a PUT of each part to its signed URL, with the part's ETag read from the answer.
import http from "node:http";

export async function putPart(url: string, body: Uint8Array): Promise<string> {
  const res = await fetch(url, { method: "PUT", body: body as BodyInit });
  if (!res.ok) throw new Error(`part PUT answered ${res.status}: ${await res.text()}`);
  return res.headers.get("etag") ?? "";
}

/** Starts a PUT of the part, sends `fraction` of its bytes, then cuts the connection (a dropped network). */
export async function putPartCut(url: string, body: Uint8Array, fraction = 0.5): Promise<void> {
  const u = new URL(url);
  await new Promise<void>((resolve) => {
    const req = http.request({ host: u.hostname, port: u.port, path: u.pathname + u.search, method: "PUT", headers: { "content-length": body.byteLength } });
    req.on("error", () => resolve());
    req.write(Buffer.from(body.buffer, body.byteOffset, Math.floor(body.byteLength * fraction)), () => {
      setTimeout(() => {
        req.destroy();
        resolve();
      }, 50);
    });
  });
}

/**
 * An hour-long log of a node that sleeps and wakes, written row by row without the app's generator: one
 * sample a millisecond, t = k ms for k = 0 … rows − 1, `active` A for samples 500 … 500 + activeSamples − 1
 * of every 1000 and `sleep` A otherwise. Times with three decimals, currents with six.
 */
export function sleepingNodeCsv(rows: number, sleep: number, active: number, activeSamples: number): Buffer {
  const sleepText = `,${sleep.toFixed(6)}\n`;
  const activeText = `,${active.toFixed(6)}\n`;
  const chunks: Buffer[] = [Buffer.from("time_s,current_A\n")];
  let text = "";
  for (let k = 0; k < rows; k++) {
    const phase = k % 1000;
    text += (k / 1000).toFixed(3) + (phase >= 500 && phase < 500 + activeSamples ? activeText : sleepText);
    if (k % 50_000 === 49_999) {
      chunks.push(Buffer.from(text));
      text = "";
    }
  }
  chunks.push(Buffer.from(text));
  return Buffer.concat(chunks);
}
