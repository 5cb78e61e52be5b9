"use client";

import { useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import { requestJson } from "@/components/api-client";
import { lazyResolver } from "@/components/api-form";
import { SaveFormShell, useSaveForm } from "@/components/save-form";
import { invalidateProject } from "./api";
import type { projectFormSchema } from "./project-form-schema";
import { CasePathFields, DesignFields, type OwnerChoice, PolicyFields } from "./project-form-sections";
import { type ProjectFormValues, projectFields } from "./project-form-values";

export { emptyProject, type ProjectFormValues } from "./project-form-values";

type ProjectBody = z.output<typeof projectFormSchema>;

/** The form's resolver: the schema (and zod with it) is loaded at the first validation, not with the page. */
const checkValues = lazyResolver<ProjectFormValues, ProjectBody>(() =>
  import("./project-form-schema").then((m) => m.projectFormSchema),
);

/**
 * A project's settings: new (POST /api/projects) or edited (PATCH /api/projects/:id). The margin policy is the
 * utilisation limit in percent, the junction guard in kelvin below T_j,max, and how to read between curves.
 */
export function ProjectForm({
  projectId,
  defaults,
  owners,
}: {
  projectId?: string;
  defaults: ProjectFormValues;
  owners: OwnerChoice[];
}) {
  const queryClient = useQueryClient();
  const { shell, bind, register, watch } = useSaveForm<ProjectFormValues, ProjectBody>({
    resolver: checkValues,
    defaultValues: defaults,
    fields: projectFields,
    save: async (values) => {
      const { project } = projectId
        ? await requestJson<{ project: { id: string } }>("PATCH", `/api/projects/${projectId}`, values)
        : await requestJson<{ project: { id: string } }>("POST", "/api/projects", values);
      await invalidateProject(queryClient, project.id);
      return `/projects/${project.id}`;
    },
  });

  return (
    <SaveFormShell
      {...shell}
      cancelHref={projectId ? `/projects/${projectId}` : "/projects"}
      label={projectId ? "Save settings" : "Create project"}
    >
      <DesignFields bind={bind} owners={owners} editing={projectId !== undefined} />
      <PolicyFields bind={bind} />
      <CasePathFields bind={bind} apply={register("applyCaseNetwork")} text={watch("caseNetwork")} />
    </SaveFormShell>
  );
}
