// The local object-storage fake: s3rver, made to behave as a real store does where the app's security rests on it.
// s3rver 3.7 accepts anonymous requests and does not check SigV4 signatures (its authentication middleware says so),
// and it has no option for either. So this launcher puts one middleware in front of it that refuses any request
// without a valid AWS Signature Version 4 (header or presigned query), checks each signed header (so a presigned
// PUT's signed Content-Length holds) and a presigned URL's expiry, and serves CORS for the app's origin only.
// Usage: node scripts/storage-fake.mjs <directory> <address> <port> <bucket> <app-origin> <access-key> <secret>
import { createHash, createHmac, timingSafeEqual } from "node:crypto";
import S3rver from "s3rver";

const [directory, address, port, bucket, appOrigin, accessKeyId, secretAccessKey] = process.argv.slice(2);

const cors = `<CORSConfiguration>
  <CORSRule>
    <AllowedOrigin>${appOrigin}</AllowedOrigin>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;

const sha256 = (data) => createHash("sha256").update(data).digest("hex");
const hmac = (key, data) => createHmac("sha256", key).update(data).digest();
// RFC 3986 unreserved characters stay; everything else is percent-encoded (SigV4 canonical query).
const encode = (s) =>
  encodeURIComponent(s).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);

function deny(ctx, code, message) {
  ctx.status = 403;
  ctx.type = "application/xml";
  ctx.body = `<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>${code}</Code><Message>${message}</Message></Error>`;
}

/** Parses the signature from the Authorization header or the presigned query; null when there is none. */
function signatureOf(ctx, query) {
  const header = ctx.get("authorization");
  if (header.startsWith("AWS4-HMAC-SHA256 ")) {
    const parts = Object.fromEntries(
      header
        .slice(17)
        .split(",")
        .map((p) => p.trim().split("=")),
    );
    return {
      credential: parts.Credential,
      signedHeaders: parts.SignedHeaders,
      signature: parts.Signature,
      amzDate: ctx.get("x-amz-date"),
      payloadHash: ctx.get("x-amz-content-sha256") || "UNSIGNED-PAYLOAD",
      expires: null,
    };
  }
  if (query.get("X-Amz-Algorithm") === "AWS4-HMAC-SHA256") {
    return {
      credential: query.get("X-Amz-Credential"),
      signedHeaders: query.get("X-Amz-SignedHeaders"),
      signature: query.get("X-Amz-Signature"),
      amzDate: query.get("X-Amz-Date"),
      payloadHash: "UNSIGNED-PAYLOAD",
      expires: Number(query.get("X-Amz-Expires")),
    };
  }
  return null;
}

function parseAmzDate(amzDate) {
  const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(amzDate ?? "");
  return m ? Date.UTC(+m[1], +m[2] - 1, +m[3], +m[4], +m[5], +m[6]) : Number.NaN;
}

/** Recomputes the request's SigV4 signature (AWS General Reference, "Signature Version 4 signing process"). */
function verify(ctx) {
  const [rawPath, rawQuery = ""] = ctx.req.url.split("?");
  const query = new URLSearchParams(rawQuery);
  const sig = signatureOf(ctx, query);
  if (!sig?.credential || !sig.signedHeaders || !sig.signature) return "AccessDenied";
  const [keyId, date, region, service, terminator] = sig.credential.split("/");
  if (keyId !== accessKeyId) return "InvalidAccessKeyId";
  const signedAt = parseAmzDate(sig.amzDate);
  if (Number.isNaN(signedAt)) return "AccessDenied";
  if (sig.expires !== null && Date.now() > signedAt + sig.expires * 1000) return "AccessDenied";
  const canonicalQuery = [...query.entries()]
    .filter(([k]) => k !== "X-Amz-Signature")
    .map(([k, v]) => [encode(k), encode(v)])
    .sort(([a, av], [b, bv]) => (a < b ? -1 : a > b ? 1 : av < bv ? -1 : 1))
    .map(([k, v]) => `${k}=${v}`)
    .join("&");
  const headerNames = sig.signedHeaders.split(";");
  const canonicalHeaders = headerNames
    .map((name) => `${name}:${(ctx.get(name) ?? "").trim().replace(/\s+/g, " ")}\n`)
    .join("");
  const canonicalRequest = [
    ctx.method,
    rawPath,
    canonicalQuery,
    canonicalHeaders,
    sig.signedHeaders,
    sig.payloadHash,
  ].join("\n");
  const scope = `${date}/${region}/${service}/${terminator}`;
  const stringToSign = ["AWS4-HMAC-SHA256", sig.amzDate, scope, sha256(canonicalRequest)].join("\n");
  let key = hmac(`AWS4${secretAccessKey}`, date);
  for (const part of [region, service, terminator]) key = hmac(key, part);
  const expected = Buffer.from(createHmac("sha256", key).update(stringToSign).digest("hex"));
  const given = Buffer.from(sig.signature);
  return expected.length === given.length && timingSafeEqual(expected, given)
    ? null
    : "SignatureDoesNotMatch";
}

const server = new S3rver({
  directory,
  address,
  port: Number(port),
  silent: true,
  configureBuckets: [{ name: bucket, configs: [cors] }],
});
server.middleware.unshift(async (ctx, next) => {
  // A CORS preflight carries no credentials by design; s3rver answers it from the bucket's CORS rules.
  if (ctx.method === "OPTIONS") return next();
  const problem = verify(ctx);
  if (problem) return deny(ctx, problem, "Only signed requests are accepted.");
  return next();
});
await server.run();
console.log(`storage fake on http://${address}:${port}, bucket ${bucket}, origin ${appOrigin}`);
