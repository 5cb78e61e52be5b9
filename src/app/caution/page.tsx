import type { Metadata } from "next";
import Link from "next/link";

export const metadata: Metadata = { title: "Caution" };

export default function CautionPage() {
  return (
    <main className="mx-auto max-w-2xl px-6 py-12 text-sm leading-relaxed">
      <Link href="/" className="text-accent">
        ← Pulsefence
      </Link>
      <h1 className="mt-6 text-2xl font-semibold">What a Pulsefence verdict means, and what it does not</h1>
      <p className="mt-4">
        A check in Pulsefence is an aid to engineering judgement. It compares the pulses you describe or
        measure with the limit lines digitised from a datasheet and with a thermal model, using the methods
        described in the app. It cannot know what was not entered, and it is only as good as the curves, the
        thermal model and the pulses given to it.
      </p>
      <ul className="mt-4 list-disc space-y-2 pl-5">
        <li>
          Datasheet SOA curves are specified at 25&nbsp;°C case temperature and for a single pulse. Pulsefence
          derates them for temperature and repetition with stated, conservative rules; the manufacturer&apos;s
          own derating guidance takes precedence.
        </li>
        <li>
          Curves read between the datasheet&apos;s pulse widths are interpolated. Interpolation can overstate
          the limit where the thermal impedance bends toward its steady value; the margin policy and the
          junction temperature check exist to cover that, not to remove it.
        </li>
        <li>
          A Foster network describes the transistor from junction to case only. It knows nothing of the
          thermal-instability region at high voltage that the curves show; both views are needed.
        </li>
        <li>
          Power electronics can store and release dangerous energy. Validate every design on hardware, with
          appropriate protection, and follow the manufacturer&apos;s guidance, the applicable safety
          standards, local codes and licensed practice.
        </li>
      </ul>
    </main>
  );
}
