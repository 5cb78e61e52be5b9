import type { UseFormRegisterReturn } from "react-hook-form";

/** How the current falls at turn-off, for the builders that turn a short off: through a clamp, or in avalanche. */
export function TurnOffChoice({
  registration,
  className,
}: {
  registration: UseFormRegisterReturn;
  className?: string;
}) {
  return (
    <fieldset className={className}>
      <legend className="mb-1 text-sm font-medium">At turn-off the current falls</legend>
      <div className="flex flex-wrap gap-x-5 gap-y-1 text-sm">
        <label className="inline-flex min-h-11 items-center gap-2">
          <input type="radio" value="clamp" {...registration} />
          through a clamp
        </label>
        <label className="inline-flex min-h-11 items-center gap-2">
          <input type="radio" value="none" {...registration} />
          with no clamp (avalanche)
        </label>
      </div>
    </fieldset>
  );
}
