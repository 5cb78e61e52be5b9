// The seeded demo workspace's people (src/lib/demo/users.ts, documented in the README), as the specs sign in.
import { demoUsers } from "../../src/lib/demo/users";
import type { Person } from "./auth-pages";

function demoPerson(role: (typeof demoUsers)[number]["role"]): Person {
  const user = demoUsers.find((u) => u.role === role);
  if (!user) throw new Error(`no demo ${role}`);
  return { name: user.name, email: user.email, password: user.password };
}

export const lead = demoPerson("lead");
export const engineer = demoPerson("engineer");
export const technician = demoPerson("technician");
