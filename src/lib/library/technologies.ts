// The transistor technologies a part may be, apart from the part schema so lists and filters carry no zod.

export const technologies = ["si-mosfet", "sic-mosfet", "gan-hemt", "igbt"] as const;
export const technologyLabels: Record<(typeof technologies)[number], string> = {
  "si-mosfet": "Si MOSFET",
  "sic-mosfet": "SiC MOSFET",
  "gan-hemt": "GaN HEMT",
  igbt: "IGBT",
};
