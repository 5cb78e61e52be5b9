"use client";

import { useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useTransition } from "react";
import { type Resolver, useForm } from "react-hook-form";
import type { z } from "zod";
import { sendJson } from "@/components/api-client";
import { Button, FormActions, FormMessage } from "@/components/form";
import { applyServerErrors, fieldBinder } from "@/components/form-errors";
import { invalidateProject } from "./api";
import type { projectFormSchema } from "./project-form-schema";
import { CasePathFields, DesignFields, type OwnerChoice, PolicyFields } from "./project-form-sections";
import { type ProjectFormValues, projectFields } from "./project-form-values";

export { emptyProject, type ProjectFormValues } from "./project-form-values";

type ProjectBody = z.output<typeof projectFormSchema>;

/** The form's resolver: the schema (and zod with it) is loaded at the first validation, not with the page. */
const checkValues: Resolver<ProjectFormValues, unknown, ProjectBody> = async (values, context, options) => {
  const [{ zodResolver }, { projectFormSchema }] = await Promise.all([
    import("@hookform/resolvers/zod"),
    import("./project-form-schema"),
  ]);
  return zodResolver(projectFormSchema)(values, context, options);
};

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
  const router = useRouter();
  const queryClient = useQueryClient();
  const [navigating, startTransition] = useTransition();
  const {
    register,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<ProjectFormValues, unknown, ProjectBody>({
    resolver: checkValues,
    defaultValues: defaults,
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      const { project } = projectId
        ? await sendJson<{ project: { id: string } }>("PATCH", `/api/projects/${projectId}`, values)
        : await sendJson<{ project: { id: string } }>("POST", "/api/projects", values);
      await invalidateProject(queryClient, project.id);
      startTransition(() => {
        router.push(`/projects/${project.id}`);
        router.refresh();
      });
    } catch (error) {
      applyServerErrors(error, setError, projectFields);
    }
  });

  const bind = fieldBinder(register, errors);

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6 rounded-md border border-line bg-panel p-5">
      <DesignFields bind={bind} owners={owners} editing={projectId !== undefined} />
      <PolicyFields bind={bind} />
      <CasePathFields bind={bind} apply={register("applyCaseNetwork")} text={watch("caseNetwork")} />

      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      <FormActions
        aside={
          <Link
            href={projectId ? `/projects/${projectId}` : "/projects"}
            className="hover:text-ink hover:underline"
          >
            Cancel
          </Link>
        }
      >
        <Button type="submit" variant="primary" pending={isSubmitting || navigating}>
          {projectId ? "Save settings" : "Create project"}
        </Button>
      </FormActions>
    </form>
  );
}
