// What the S3 stand-in (s3rver 3.7.1) lacks of the multipart API and Shuntwise uses: ListParts
// (GET ?uploadId=) and AbortMultipartUpload (DELETE ?uploadId=). s3rver keeps a multipart upload's parts
// as files `<n>` with `<n>.md5` beside them in `<directory>/<bucket>/<uploads subresource>/<uploadId>/`;
// these two answer from that folder, in the shape S3 documents (ListPartsResult, 204 for an abort).
// Signatures are not checked here (local stand-in only; the app's own calls are signed by the SDK).
import fs from "node:fs";
import path from "node:path";

type Ctx = { method: string; path: string; query: Record<string, string | string[] | undefined>; status: number; body: unknown; type: string };
type Next = () => Promise<unknown>;

/** `store.getResourcePath(bucket, undefined, "uploads")`: where s3rver keeps a bucket's multipart uploads. */
type Store = { getResourcePath(bucket: string, key: string | undefined, resource: string): string };

const xmlEscape = (s: string) => s.replace(/[<>&'"]/g, (c) => `&#${c.charCodeAt(0)};`);

export function multipartExtras(store: Store) {
  return async function extras(ctx: Ctx, next: Next) {
    const uploadId = typeof ctx.query.uploadId === "string" ? ctx.query.uploadId : undefined;
    const m = /^\/([^/]+)\/(.+)$/.exec(ctx.path);
    if (!uploadId || !m || !/^[0-9a-f]+$/i.test(uploadId) || !(ctx.method === "GET" || ctx.method === "DELETE")) return next();
    const [, bucket, key] = m;
    const dir = path.join(store.getResourcePath(bucket, undefined, "uploads"), uploadId);
    if (!fs.existsSync(dir)) {
      ctx.status = 404;
      ctx.type = "application/xml";
      ctx.body = `<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>NoSuchUpload</Code><Message>The specified upload does not exist.</Message><UploadId>${xmlEscape(uploadId)}</UploadId></Error>`;
      return;
    }
    if (ctx.method === "DELETE") {
      fs.rmSync(dir, { recursive: true, force: true });
      ctx.status = 204;
      ctx.body = "";
      return;
    }
    const parts = fs
      .readdirSync(dir)
      .filter((f) => /^\d+$/.test(f) && fs.existsSync(path.join(dir, `${f}.md5`)))
      .map((f) => {
        const stat = fs.statSync(path.join(dir, f));
        return { number: Number(f), size: stat.size, modified: stat.mtime, etag: fs.readFileSync(path.join(dir, `${f}.md5`), "utf8").trim() };
      })
      .sort((a, b) => a.number - b.number);
    ctx.status = 200;
    ctx.type = "application/xml";
    ctx.body =
      `<?xml version="1.0" encoding="UTF-8"?>\n<ListPartsResult xmlns="http://s3.amazonaws.com/doc/2006-03-01/">` +
      `<Bucket>${xmlEscape(bucket)}</Bucket><Key>${xmlEscape(decodeURIComponent(key))}</Key><UploadId>${xmlEscape(uploadId)}</UploadId>` +
      `<MaxParts>10000</MaxParts><IsTruncated>false</IsTruncated>` +
      parts.map((p) => `<Part><PartNumber>${p.number}</PartNumber><LastModified>${p.modified.toISOString()}</LastModified><ETag>"${p.etag}"</ETag><Size>${p.size}</Size></Part>`).join("") +
      `</ListPartsResult>`;
  };
}

/**
 * CORS of the upload bucket: the browser sends parts straight to the store (PUT) and reads each part's
 * ETag; signed downloads are GETs. Any origin: the URLs carry their own signatures.
 */
export const UPLOAD_BUCKET_CORS = `<CORSConfiguration>
  <CORSRule>
    <AllowedOrigin>*</AllowedOrigin>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;
