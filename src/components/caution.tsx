import Link from "next/link";

/** The short safety caution that sits under every verdict area (DESIGN.md, Cautions). */
export function Caution({ className = "" }: { className?: string }) {
  return (
    <p className={`text-xs leading-relaxed text-ink-muted ${className}`}>
      A Pulsefence check is an aid to engineering judgement, not a guarantee. Datasheet SOA curves hold at
      25&nbsp;°C case and single pulse; validate every design on hardware and follow the manufacturer&apos;s
      guidance, the applicable safety standards, local codes and licensed practice.{" "}
      <Link href="/caution" className="text-accent underline underline-offset-2">
        Read the full caution
      </Link>
    </p>
  );
}
