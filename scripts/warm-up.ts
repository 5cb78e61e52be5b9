// Warms freshly started app processes before the first user does (start_app in services.sh): a process compiles
// and optimises its code over its first thousands of requests, and its first minute under load was several times
// slower than the rest. Each process on the given loopback ports is asked, one request at a time, for the public
// pages and the sign-in redirects of the main pages (no session, nothing written), ROUNDS times; each lean API
// server for health and an unauthenticated check (401). Prints what it did; a failure is printed and the start
// goes on.
// Run: `tsx scripts/warm-up.ts ROUNDS app:PORT… api:PORT…`
export {};

const [rounds, ...targets] = process.argv.slice(2);
const pagePaths = ["/", "/sign-in", "/sign-up", "/forgot", "/app", "/projects", "/library", "/team"];

async function ask(port: string, path: string, init: RequestInit = {}): Promise<void> {
  const res = await fetch(`http://127.0.0.1:${port}${path}`, { ...init, redirect: "manual" });
  await res.arrayBuffer();
}

const started = performance.now();
await Promise.all(
  targets.map(async (target) => {
    const [kind, port] = target.split(":");
    for (let round = 0; round < Number(rounds); round++) {
      if (kind === "app") for (const path of pagePaths) await ask(port, path);
      else {
        await ask(port, "/api/health");
        await ask(port, "/api/v1/check", { method: "POST", body: "{}" });
      }
    }
  }),
).catch((error) => console.error(`warm-up stopped early: ${error}`));
console.log(
  `warmed ${targets.length} processes, ${rounds} rounds, in ${((performance.now() - started) / 1000).toFixed(1)} s`,
);
