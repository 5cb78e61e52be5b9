import { describe, expect, it, vi } from "vitest";
import { AppError, errorResponse, toAppError } from "./errors";

describe("AppError", () => {
  it("derives the HTTP status from the code's kind", () => {
    expect(new AppError("not_found:part", "No such part").status).toBe(404);
    expect(new AppError("forbidden", "No").status).toBe(403);
    expect(new AppError("rate_limited:sign-in", "Slow down").status).toBe(429);
    expect(new AppError("unavailable:storage", "Down").status).toBe(503);
  });

  it("turns an unknown error into a safe internal error that keeps the cause", () => {
    const spy = vi.spyOn(console, "error").mockImplementation(() => {});
    const cause = new Error("connection string postgres://secret@host");
    const error = toAppError(cause);
    expect(error.status).toBe(500);
    expect(error.message).not.toContain("secret");
    expect(error.cause).toBe(cause);
    spy.mockRestore();
  });

  it("responds with JSON and no stack trace", async () => {
    const res = errorResponse(new AppError("invalid:csv", "Row 3, column V: not a number"));
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body).toEqual({ error: { code: "invalid:csv", message: "Row 3, column V: not a number" } });
    expect(JSON.stringify(body)).not.toMatch(/at .*\.ts/);
  });
});
