// Integration test of the command line door (METHODS.md §9): spawns `tsx scripts/soa.ts` as npm would.
import { spawn } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const tsx = path.join(root, "node_modules", ".bin", "tsx");
const cli = path.join(root, "scripts", "soa.ts");

function run(
  args: string[],
  input: string,
): Promise<{ code: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(tsx, [cli, ...args], { cwd: root, timeout: 90_000 });
    let stdout = "";
    let stderr = "";
    child.stdout.setEncoding("utf8").on("data", (chunk: string) => (stdout += chunk));
    child.stderr.setEncoding("utf8").on("data", (chunk: string) => (stderr += chunk));
    child.on("error", reject);
    child.on("close", (code) => resolve({ code, stdout, stderr }));
    child.stdin.end(input);
  });
}

function valid(): Record<string, unknown> & {
  part: Record<string, unknown>;
  pulses: Record<string, unknown>[];
} {
  return {
    part: {
      vdsMax: 60,
      tjMax: 175,
      foster: [
        { r: 0.1, tau: 1e-3 },
        { r: 0.4, tau: 0.1 },
      ],
      soa: {
        curves: [
          {
            duration: 1e-3,
            points: [
              [1, 40],
              [60, 40],
            ],
          },
          {
            duration: 1e-2,
            points: [
              [1, 16],
              [60, 16],
            ],
          },
        ],
      },
    },
    caseTemp: 100,
    pulses: [
      { id: "a", kind: "rect", v: 20, i: 12, duration: 2e-3 },
      { id: "b", kind: "triangle", v: 20, i: 12, duration: 2e-3, repeat: { period: 0.02, count: 5 } },
      { id: "c", kind: "waveform", t: [0, 1e-3, 2e-3, 3e-3], v: [20, 20, 20, 20], i: [0, 10, 10, 0] },
    ],
  };
}

async function expectError(input: string, path: string): Promise<string> {
  const { code, stdout, stderr } = await run(["check"], input);
  expect(code).toBe(2);
  const body = JSON.parse(stdout);
  expect(Object.keys(body)).toEqual(["error"]);
  expect(body.error.path).toBe(path);
  expect(typeof body.error.message).toBe("string");
  expect(body.error.message.length).toBeGreaterThan(0);
  expect(`${stdout}${stderr}`).not.toMatch(/\n\s+at .+:\d+:\d+/);
  return body.error.message as string;
}

// Each case spawns a fresh tsx process (about a second idle, far more on a busy machine).
describe("soa check (command line)", { timeout: 120_000 }, () => {
  it("prints the response for a valid request and exits 0", async () => {
    const { code, stdout } = await run(["check"], JSON.stringify(valid()));
    expect(code).toBe(0);
    const { results } = JSON.parse(stdout);
    expect(results.map((r: { id: string }) => r.id)).toEqual(["a", "b", "c"]);
    // METHODS.md §10 worked value "utilisation" (derived): limit 15.18 A, u = 0.791.
    expect(results[0].allowedCurrent).toBeCloseTo(15.18, 2);
    expect(results[0].utilisation).toBeCloseTo(0.791, 3);
  });

  it("rejects a missing part", async () => {
    const body = valid();
    delete (body as Record<string, unknown>).part;
    expect(await expectError(JSON.stringify(body), "part")).toBe("is required");
  });

  it("rejects a negative voltage", async () => {
    const body = valid();
    body.pulses[0].v = -20;
    await expectError(JSON.stringify(body), "pulses[0].v");
  });

  it("rejects unsorted duplicate points", async () => {
    const body = valid();
    (body.part.soa as { curves: { points: number[][] }[] }).curves[1].points = [
      [60, 16],
      [1, 16],
      [60, 12],
    ];
    await expectError(JSON.stringify(body), "part.soa.curves[1].points[2]");
  });

  it('rejects the string "NaN" where a number is expected', async () => {
    const body = valid();
    body.caseTemp = "NaN";
    await expectError(JSON.stringify(body), "caseTemp");
  });

  it("rejects null where a number is expected", async () => {
    const body = valid();
    body.caseTemp = null;
    await expectError(JSON.stringify(body), "caseTemp");
  });

  it('rejects a bare NaN (not JSON) as invalid JSON at path ""', async () => {
    const text = JSON.stringify(valid()).replace('"caseTemp":100', '"caseTemp":NaN');
    expect(await expectError(text, "")).toMatch(/not valid JSON/);
  });

  it("rejects an unknown pulse kind", async () => {
    const body = valid();
    body.pulses[1].kind = "sawtooth";
    await expectError(JSON.stringify(body), "pulses[1].kind");
  });

  it("rejects waveform arrays of different lengths", async () => {
    const body = valid();
    body.pulses[2].i = [0, 10, 10];
    await expectError(JSON.stringify(body), "pulses[2].i");
  });

  it("rejects a time axis that goes backwards", async () => {
    const body = valid();
    body.pulses[2].t = [0, 2e-3, 1e-3, 3e-3];
    await expectError(JSON.stringify(body), "pulses[2].t[2]");
  });

  it("prints the usage on stderr and exits 2 for an unknown subcommand", async () => {
    const { code, stdout, stderr } = await run(["verify"], "{}");
    expect(code).toBe(2);
    expect(stdout).toBe("");
    expect(stderr).toMatch(/^unknown arguments: verify\nusage: npm run --silent soa -- check/);
  });

  it("prints the usage and exits 2 without a subcommand", async () => {
    const { code, stderr } = await run([], "");
    expect(code).toBe(2);
    expect(stderr).toMatch(/^missing subcommand\nusage:/);
  });
});
