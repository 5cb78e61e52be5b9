import type { HTMLAttributes } from "react";

/**
 * A box whose content may scroll (a wide table on a phone, a long one on a desktop). It takes keyboard focus so that
 * the arrow keys scroll it when nothing inside is focusable (WCAG 2.1.1; axe-core's scrollable-region-focusable).
 */
export function ScrollRegion(props: HTMLAttributes<HTMLDivElement>) {
  // biome-ignore lint/a11y/noNoninteractiveTabindex: a scrolling region must be reachable by keyboard.
  return <div tabIndex={0} {...props} />;
}
