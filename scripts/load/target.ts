// The app the load scripts drive, and their sign-in: only a loopback address is ever sent traffic.
import { demoUsers } from "../../src/lib/demo/users";

/**
 * The origin of the started app: PF_LOAD_URL, default http://127.0.0.1:<3000 + PF_PORT_OFFSET>. Throws unless it is
 * this machine's loopback address; `traffic` names what would have been sent, for the message.
 */
export function loopbackOrigin(traffic: string): string {
  const base = new URL(
    process.env.PF_LOAD_URL ?? `http://127.0.0.1:${3000 + Number(process.env.PF_PORT_OFFSET ?? 0)}`,
  );
  if (!["127.0.0.1", "localhost", "[::1]"].includes(base.hostname) && !base.hostname.startsWith("127.")) {
    throw new Error(`${traffic} only to this machine's loopback address, not ${base.hostname}`);
  }
  return base.origin;
}

/** Signs in as the demo engineer and answers the session cookie as a request sends it ("name=value"). */
export async function engineerSession(origin: string): Promise<string> {
  const engineer = demoUsers.find((u) => u.role === "engineer")!;
  const res = await fetch(`${origin}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json", origin },
    body: JSON.stringify({ email: engineer.email, password: engineer.password }),
  });
  if (!res.ok) throw new Error(`sign-in answered ${res.status}: is the demo workspace seeded?`);
  const cookie = res.headers.getSetCookie().find((c) => c.startsWith("pulsefence_session="));
  if (!cookie) throw new Error("sign-in set no session cookie");
  return cookie.split(";")[0];
}
