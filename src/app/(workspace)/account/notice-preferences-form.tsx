"use client";

import { useState } from "react";
import { requestJson } from "@/components/api-client";
import { ApiFormShell, useApiForm } from "@/components/api-form";
import { FormMessage } from "@/components/form";

interface Preferences {
  failingEvidence: boolean;
  decisionDrift: boolean;
  verificationLapsed: boolean;
}

const choices: { key: keyof Preferences; label: string; hint: string }[] = [
  {
    key: "failingEvidence",
    label: "Failing evidence on projects I own",
    hint: "One e-mail per paste, upload or bench post, listing each measured pulse or capture that fails or has no data.",
  },
  {
    key: "decisionDrift",
    label: "Standing decisions that drift",
    hint: "When a library change alters a verdict a decision rests on, for decisions I signed or on projects I own.",
  },
  {
    key: "verificationLapsed",
    label: "Parts I verified go back to draft",
    hint: "When someone changes the curves, ratings or models of a part I verified.",
  },
];

export function NoticePreferencesForm({ preferences }: { preferences: Preferences }) {
  const [saved, setSaved] = useState(false);
  const { register, reset, formState, shell } = useApiForm<Preferences>({
    schema: () => import("@/lib/auth/schemas").then((m) => m.noticePreferencesSchema),
    defaultValues: preferences,
    send: async (values) => {
      setSaved(false);
      const data = await requestJson<{ preferences: Preferences }>("PATCH", "/api/account/notices", values);
      reset(data.preferences);
      setSaved(true);
    },
  });

  return (
    <ApiFormShell
      {...shell}
      className="rounded-md border border-line bg-panel p-4"
      label="Save notices"
      disabled={!formState.isDirty}
      status={saved ? <FormMessage tone="done">Notice choices saved.</FormMessage> : null}
    >
      <fieldset>
        <legend className="text-sm font-medium text-ink">E-mail me about</legend>
        <div className="mt-2 space-y-3">
          {choices.map((c) => (
            <label key={c.key} className="flex min-h-11 items-start gap-3 text-sm md:min-h-0">
              <input
                type="checkbox"
                className="mt-1 size-4 shrink-0"
                aria-describedby={`notice-${c.key}-hint`}
                {...register(c.key, { onChange: () => setSaved(false) })}
              />
              <span>
                <span className="text-ink">{c.label}</span>
                <span id={`notice-${c.key}-hint`} className="block text-xs text-ink-muted">
                  {c.hint}
                </span>
              </span>
            </label>
          ))}
        </div>
      </fieldset>
      <p className="mt-3 text-xs text-ink-muted">
        Invitations, password reset and sign-up e-mails are about your account and always sent.
      </p>
    </ApiFormShell>
  );
}
