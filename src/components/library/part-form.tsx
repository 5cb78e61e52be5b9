"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useTransition } from "react";
import { type Resolver, useForm } from "react-hook-form";
import { sendJson } from "@/components/api-client";
import { Button, FormActions, FormMessage } from "@/components/form";
import { applyServerErrors, fieldBinder } from "@/components/form-errors";
import type { PartInput, partSchema } from "@/lib/library/part-schema";
import { TextAreaField } from "./fields";
import { AvalancheFields, IdentityFields, PurchasingFields, RatingFields } from "./part-form-sections";

type PartBody = ReturnType<typeof partSchema.parse>;

/** The form's resolver: the schema (and zod with it) is loaded at the first check, not with the page. */
const checkPart: Resolver<PartInput, unknown, PartBody> = async (values, context, options) => {
  const [{ zodResolver }, { partSchema }] = await Promise.all([
    import("@hookform/resolvers/zod"),
    import("@/lib/library/part-schema"),
  ]);
  return zodResolver(partSchema)(values, context, options);
};

export type PartFormValues = {
  partNumber: string;
  maker: string;
  technology: string;
  package: string;
  vdsMax: string;
  idMax: string;
  idPulseMax: string;
  rdsOn: string;
  tjMax: string;
  rthJc: string;
  avalancheEnergy: string;
  avalancheCurrent: string;
  avalancheBreakdown: string;
  unitCost: string;
  currency: string;
  datasheetRevision: string;
  notes: string;
};

export const emptyPart: PartFormValues = {
  partNumber: "",
  maker: "",
  technology: "si-mosfet",
  package: "",
  vdsMax: "",
  idMax: "",
  idPulseMax: "",
  rdsOn: "",
  tjMax: "175",
  rthJc: "",
  avalancheEnergy: "",
  avalancheCurrent: "",
  avalancheBreakdown: "",
  unitCost: "",
  currency: "EUR",
  datasheetRevision: "",
  notes: "",
};

const fields = Object.keys(emptyPart) as (keyof PartFormValues)[];

/**
 * A part's ratings: new (POST /api/parts) or edited (PATCH /api/parts/:id). One zod schema checks the form
 * here and the request on the server; numbers may be typed in engineering notation and are stored in SI units.
 */
export function PartForm({
  partId,
  defaults,
  facets,
}: {
  partId?: string;
  defaults: PartFormValues;
  facets: { makers: string[]; packages: string[] };
}) {
  const router = useRouter();
  const [navigating, startTransition] = useTransition();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<PartInput, unknown, PartBody>({
    resolver: checkPart,
    defaultValues: defaults as PartInput,
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      const { part } = partId
        ? await sendJson<{ part: { id: string } }>("PATCH", `/api/parts/${partId}`, values)
        : await sendJson<{ part: { id: string } }>("POST", "/api/parts", values);
      startTransition(() => {
        router.push(`/library/${part.id}`);
        router.refresh();
      });
    } catch (error) {
      applyServerErrors(error, setError, fields, { "conflict:part": "partNumber" });
    }
  });

  const bind = fieldBinder(register, errors);

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6 rounded-md border border-line bg-panel p-5">
      <IdentityFields bind={bind} facets={facets} />
      <RatingFields bind={bind} />
      <AvalancheFields bind={bind} />
      <PurchasingFields bind={bind} />

      <TextAreaField id="part-notes" label="Notes" hint="Optional" {...bind("notes")} />

      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      <FormActions
        aside={
          <Link href={partId ? `/library/${partId}` : "/library"} className="hover:text-ink hover:underline">
            Cancel
          </Link>
        }
      >
        <Button type="submit" variant="primary" pending={isSubmitting || navigating}>
          {partId ? "Save part" : "Create part"}
        </Button>
      </FormActions>
    </form>
  );
}
