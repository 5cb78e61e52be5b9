// A curve-set file uploaded the way the browser does it: ask the part's upload route for a ticket, PUT the file to
// the presigned URL, then register the upload with the part's curve-set route.
import { expect } from "vitest";
import { POST as registerPost } from "@/app/api/parts/[id]/curve-sets/route";
import { POST as uploadPost } from "@/app/api/parts/[id]/uploads/route";
import { call } from "./fixtures";

/** The file `text` stored under a new upload ticket of the part; fails the test if storage refuses it. */
export async function browserUpload(
  cookie: string,
  partId: string,
  text: string,
): Promise<{ uploadId: string; objectKey: string }> {
  const res = await call(uploadPost, "POST", {
    cookie,
    params: { id: partId },
    body: { fileName: "figure-9.csv", size: Buffer.byteLength(text), purpose: "curve-set" },
  });
  expect(res.status).toBe(201);
  const ticket = await res.json();
  const put = await fetch(ticket.url, { method: "PUT", body: text, headers: { "content-type": "text/csv" } });
  expect(put.status).toBe(200);
  return ticket;
}

/** The curve-set route's answer to registering the upload as a set of the part. */
export function registerUpload(cookie: string, partId: string, uploadId: string): Promise<Response> {
  return call(registerPost, "POST", { cookie, params: { id: partId }, body: { uploadId } });
}
