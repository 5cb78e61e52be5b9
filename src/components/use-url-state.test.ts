import { describe, expect, it } from "vitest";
import { nextSearch, urlOf } from "./use-url-state";

describe("nextSearch", () => {
  it("sets, replaces and removes parameters and keeps the others in their order", () => {
    expect(nextSearch("tab=captures&capture=a1&pulse=p", { capture: "b2", pulse: null, decide: "1" })).toBe(
      "tab=captures&capture=b2&decide=1",
    );
  });

  it("replaces the whole set when given search parameters", () => {
    expect(nextSearch("q=x&page=3", new URLSearchParams({ sort: "maker" }))).toBe("sort=maker");
    expect(nextSearch("q=x&page=3", new URLSearchParams())).toBe("");
  });

  it("encodes values so they read back the same", () => {
    const text = nextSearch("", { q: "a&b=c 100 %" });
    expect(new URLSearchParams(text).get("q")).toBe("a&b=c 100 %");
  });

  it("removing what is not there changes nothing", () => {
    expect(nextSearch("a=1", { b: null })).toBe("a=1");
  });
});

describe("urlOf", () => {
  it("leaves no bare question mark", () => {
    expect(urlOf("/library", "")).toBe("/library");
    expect(urlOf("/library", "q=x")).toBe("/library?q=x");
  });
});
