// Every workspace page has an error boundary of its own segment, and every workspace page without an id in its
// path a loading state that says what is loading. No loading boundary sits above a page with an id: such a page
// must answer 404 before anything is streamed, which a loading boundary above it would prevent; it renders a
// <Suspense> after its not-found check instead, whose fallback says what is loading. The not-allowed page reads
// nothing slow (the member it already has, and the admins' names) and has no loading state. The root has a
// global-error.tsx for a failure in the root layout itself.
import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const app = import.meta.dirname;
const workspace = path.join(app, "(workspace)");

function pages(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return name === "api" ? [] : pages(full);
    return name === "page.tsx" ? [dir] : [];
  });
}

/** The folders from `dir` up to (not including) `top`. */
function upTo(dir: string, top: string): string[] {
  const folders: string[] = [];
  for (let d = dir; d !== top && d.startsWith(top); d = path.dirname(d)) folders.push(d);
  return folders;
}

const rel = (dir: string) => path.relative(app, dir);
const workspacePages = pages(workspace);

describe("error and loading boundaries", () => {
  it("finds the workspace pages", () => {
    expect(workspacePages.length).toBeGreaterThan(10);
  });

  it("every page in a route group has an error boundary of its segment or its group", () => {
    for (const dir of pages(app)) {
      // The two route groups need their own; a plain page (the start page, the caution) has the root's.
      const grouped = /^\(/.test(rel(dir));
      const found = [...upTo(dir, app), ...(grouped ? [] : [app])].some((d) =>
        existsSync(path.join(d, "error.tsx")),
      );
      expect(found, `${rel(dir)} has no error.tsx`).toBe(true);
    }
    expect(existsSync(path.join(app, "error.tsx"))).toBe(true);
  });

  it("every workspace page without an id has a loading state, and none sits above a page with an id", () => {
    for (const dir of workspacePages) {
      const loading = upTo(dir, workspace).filter((d) => existsSync(path.join(d, "loading.tsx")));
      if (rel(dir).includes("[")) expect(loading, `${rel(dir)} must answer 404 before streaming`).toEqual([]);
      else if (!rel(dir).includes("not-allowed"))
        expect(loading.length, `${rel(dir)} has no loading.tsx`).toBe(1);
    }
  });

  it("every workspace page with an id shows a loading state after its not-found check", () => {
    const withId = workspacePages.filter((dir) => rel(dir).includes("["));
    expect(withId.length).toBeGreaterThan(5);
    for (const dir of withId) {
      const text = readFileSync(path.join(dir, "page.tsx"), "utf8");
      // The not-found check is awaited in the page before the first <Suspense> renders (in the page or a helper).
      expect(text, `${rel(dir)} answers 404 for an unknown id`).toMatch(/\bnotFound\(\)/);
      const suspense = text.indexOf("<Suspense");
      expect(suspense, `${rel(dir)} has no <Suspense> loading state`).toBeGreaterThan(-1);
      expect(text.slice(suspense), rel(dir)).toMatch(
        />\s*(Loading|Checking) (the|your) [^<]*[a-z][^<]*…\s*</,
      );
    }
  });

  it("the root has a global error boundary that renders its own document", () => {
    const text = readFileSync(path.join(app, "global-error.tsx"), "utf8");
    expect(text).toMatch(/^"use client";/);
    expect(text).toMatch(/<html[\s>]/);
    expect(text).toMatch(/<body[\s>]/);
  });

  it("every loading state says what is loading", () => {
    for (const dir of workspacePages.flatMap((d) => upTo(d, workspace))) {
      const file = path.join(dir, "loading.tsx");
      if (!existsSync(file)) continue;
      expect(readFileSync(file, "utf8"), rel(file)).toMatch(/>Loading (the|your) [^<]*[a-z][^<]*…</);
    }
  });
});
