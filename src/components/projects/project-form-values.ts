// The project form's values as typed, and its fields: no zod here, so the form's pages load without it (the schema
// that checks them, project-form-schema.ts, is loaded when the form first validates).

export interface ProjectFormValues {
  name: string;
  description: string;
  caseTemp: string;
  /** In percent on the form; the schema takes a fraction. */
  utilisationLimit: string;
  tjGuard: string;
  /** In percent of V_DSS on the form; the schema takes a fraction. */
  voltageLimit: string;
  betweenCurves: "loglog" | "next-longer" | "thermal";
  ownerId: string;
  /** The case path's Foster terms as typed or pasted: one "R τ" per line. */
  caseNetwork: string;
  applyCaseNetwork: boolean;
}

export const emptyProject: ProjectFormValues = {
  name: "",
  description: "",
  caseTemp: "25",
  utilisationLimit: "80",
  tjGuard: "25",
  voltageLimit: "80",
  betweenCurves: "loglog",
  ownerId: "",
  caseNetwork: "",
  applyCaseNetwork: false,
};

export const projectFields = Object.keys(emptyProject) as (keyof ProjectFormValues)[];
