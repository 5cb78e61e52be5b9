"use client";

import { useMutation } from "@tanstack/react-query";
import { useId, useState } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { Button } from "@/components/form";
import { type FindingLike, findingKey } from "@/lib/library/finding-key";

export interface OpenFinding extends FindingLike {
  size?: string;
}

/**
 * "Mark verified" for a lead: lists the active curve set's open findings, each to be accepted with a reason
 * (the server refuses a verification that leaves one without), then verifies. Without findings it only asks to
 * confirm the ratings and curves against the datasheet.
 */
export function VerifyPart({
  partId,
  findings,
  pending,
  onVerified,
  onCancel,
}: {
  partId: string;
  findings: OpenFinding[];
  pending: boolean;
  onVerified: () => void;
  onCancel: () => void;
}) {
  const id = useId();
  const [reasons, setReasons] = useState<Record<string, string>>({});
  const [tried, setTried] = useState(false);
  const verify = useMutation({
    mutationFn: () =>
      requestJson("POST", `/api/parts/${partId}/verify`, {
        acceptances: findings.map((f) => ({ key: findingKey(f), reason: reasons[findingKey(f)] ?? "" })),
      }),
    onSuccess: onVerified,
  });
  const missing = findings.filter((f) => (reasons[findingKey(f)] ?? "").trim() === "");
  return (
    <form
      noValidate
      aria-label="Verify the part"
      data-testid="verify-part"
      className="basis-full space-y-3 rounded-md border border-line bg-panel p-4 text-left text-sm"
      onSubmit={(e) => {
        e.preventDefault();
        setTried(true);
        if (missing.length === 0) verify.mutate();
      }}
    >
      <p className="font-medium">
        {findings.length === 0
          ? "Confirm that the ratings, the curves and the thermal model match the datasheet."
          : `The active curve set has ${findings.length} open ${findings.length === 1 ? "finding" : "findings"}. Accept each with a reason to verify the part.`}
      </p>
      {findings.length ? (
        <ol className="space-y-3">
          {findings.map((f, k) => {
            const key = findingKey(f);
            const field = `${id}-${k}`;
            const error = tried && (reasons[key] ?? "").trim() === "" ? "Give the reason to accept it" : null;
            return (
              <li key={key} className="space-y-1">
                <label htmlFor={field} className="block text-ink">
                  <span className="font-medium">Finding {k + 1}</span>
                  {f.size ? <span className="text-ink-muted"> ({f.size})</span> : null}:{" "}
                  {f.message.charAt(0).toUpperCase() + f.message.slice(1)}.
                </label>
                <textarea
                  id={field}
                  rows={2}
                  value={reasons[key] ?? ""}
                  onChange={(e) => setReasons((r) => ({ ...r, [key]: e.target.value }))}
                  placeholder="Why this is acceptable, e.g. as drawn in the datasheet figure, checked on revision C"
                  aria-invalid={error ? true : undefined}
                  aria-describedby={error ? `${field}-error` : undefined}
                  className="block w-full rounded-md border border-line-strong bg-panel px-2.5 py-1.5 text-sm aria-invalid:border-fail"
                />
                {error ? (
                  <p id={`${field}-error`} className="text-xs text-fail">
                    {error}
                  </p>
                ) : null}
              </li>
            );
          })}
        </ol>
      ) : null}
      {tried && missing.length > 0 ? (
        <p role="alert" className="text-fail">
          {missing.length} {missing.length === 1 ? "finding has" : "findings have"} no reason yet.
        </p>
      ) : null}
      {verify.isError ? (
        <p role="alert" className="text-fail">
          {messageOf(verify.error)}
        </p>
      ) : null}
      <div className="flex justify-end gap-2">
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" variant="primary" pending={verify.isPending || pending}>
          {findings.length ? "Accept and verify" : "Verify"}
        </Button>
      </div>
    </form>
  );
}
