import type { Role } from "@/db/schema";

// The demo workspace's people: invented names, documented demo passwords (README), one per role.
export const demoWorkspace = { name: "Tidewater Power Lab", slug: "tidewater-power-lab" };

export const demoUsers: { role: Role; name: string; email: string; password: string }[] = [
  {
    role: "admin",
    name: "Noor Halvorsen",
    email: "admin@tidewater.example",
    password: "tidewater-admin-demo",
  },
  {
    role: "lead",
    name: "Teodor Vasquez-Lind",
    email: "lead@tidewater.example",
    password: "tidewater-lead-demo",
  },
  {
    role: "engineer",
    name: "Imke Osei",
    email: "engineer@tidewater.example",
    password: "tidewater-engineer-demo",
  },
  {
    role: "technician",
    name: "Rafi Doucette",
    email: "tech@tidewater.example",
    password: "tidewater-tech-demo",
  },
];
