"use client";

import { useMutation } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { Button, linkButtonClass } from "@/components/form";
import { type OpenFinding, VerifyPart } from "./verify-part";

/**
 * The part's actions by role: edit and archive with part.write, "Mark verified" with part.verify. Technicians see
 * none of them (and the server refuses them anyway).
 */
export function PartActions({
  partId,
  archived,
  status,
  hasCurves,
  canWrite,
  canVerify,
  findings,
}: {
  partId: string;
  archived: boolean;
  status: "draft" | "verified";
  hasCurves: boolean;
  canWrite: boolean;
  canVerify: boolean;
  /** The active curve set's findings, each to be accepted with a reason on verifying. */
  findings: OpenFinding[];
}) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [confirming, setConfirming] = useState(false);
  const [verifying, setVerifying] = useState(false);
  const refresh = () => startTransition(() => router.refresh());
  const archive = useMutation({
    mutationFn: (value: boolean) => requestJson("POST", `/api/parts/${partId}/archive`, { archived: value }),
    onSuccess: () => {
      setConfirming(false);
      refresh();
    },
  });
  const error = archive.error;
  if (!canWrite && !canVerify) return null;
  return (
    <>
      {canVerify && status === "draft" && !archived ? (
        <Button
          variant="primary"
          disabled={!hasCurves || verifying}
          title={
            hasCurves ? "Confirm the ratings and curves against the datasheet" : "Upload the SOA curves first"
          }
          onClick={() => setVerifying(true)}
        >
          Mark verified{findings.length ? ` (${findings.length} open)` : ""}
        </Button>
      ) : null}
      {canWrite ? (
        <>
          <Link href={`/library/${partId}/edit`} className={linkButtonClass}>
            Edit part
          </Link>
          {archived ? (
            <Button pending={archive.isPending || refreshing} onClick={() => archive.mutate(false)}>
              Restore
            </Button>
          ) : confirming ? (
            <span className="inline-flex items-center gap-2 text-sm">
              Archive this part?
              <Button
                variant="danger"
                pending={archive.isPending || refreshing}
                onClick={() => archive.mutate(true)}
              >
                Archive
              </Button>
              <Button variant="quiet" onClick={() => setConfirming(false)}>
                Keep
              </Button>
            </span>
          ) : (
            <Button onClick={() => setConfirming(true)}>Archive…</Button>
          )}
        </>
      ) : null}
      {verifying && canVerify && status === "draft" ? (
        <VerifyPart
          partId={partId}
          findings={findings}
          pending={refreshing}
          onVerified={() => {
            setVerifying(false);
            refresh();
          }}
          onCancel={() => setVerifying(false)}
        />
      ) : null}
      {error ? (
        <span role="alert" className="basis-full text-right text-sm text-fail">
          {messageOf(error)}
        </span>
      ) : null}
    </>
  );
}
