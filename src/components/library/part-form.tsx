"use client";

import { requestJson } from "@/components/api-client";
import { lazyResolver } from "@/components/api-form";
import { SaveFormShell, useSaveForm } from "@/components/save-form";
import type { PartInput, partSchema } from "@/lib/library/part-schema";
import { TextAreaField } from "./fields";
import { AvalancheFields, IdentityFields, PurchasingFields, RatingFields } from "./part-form-sections";

type PartBody = ReturnType<typeof partSchema.parse>;

/** The form's resolver: the schema (and zod with it) is loaded at the first check, not with the page. */
const checkPart = lazyResolver<PartInput, PartBody>(() =>
  import("@/lib/library/part-schema").then((m) => m.partSchema),
);

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
  const { shell, bind } = useSaveForm<PartInput, PartBody>({
    resolver: checkPart,
    defaultValues: defaults as PartInput,
    fields,
    codes: { "conflict:part": "partNumber" },
    save: async (values) => {
      const { part } = partId
        ? await requestJson<{ part: { id: string } }>("PATCH", `/api/parts/${partId}`, values)
        : await requestJson<{ part: { id: string } }>("POST", "/api/parts", values);
      return `/library/${part.id}`;
    },
  });

  return (
    <SaveFormShell
      {...shell}
      cancelHref={partId ? `/library/${partId}` : "/library"}
      label={partId ? "Save part" : "Create part"}
    >
      <IdentityFields bind={bind} facets={facets} />
      <RatingFields bind={bind} />
      <AvalancheFields bind={bind} />
      <PurchasingFields bind={bind} />

      <TextAreaField id="part-notes" label="Notes" hint="Optional" {...bind("notes")} />
    </SaveFormShell>
  );
}
