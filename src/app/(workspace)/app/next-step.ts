import type { PageMember } from "@/lib/auth/page";

export interface NextStep {
  text: string;
  /** A link to the place to do it; absent when the step is the sample project's button. */
  link?: { href: string; label: string };
  sample?: boolean;
}

/** The one next thing the overview suggests, by what the caller may do and what the workspace holds. */
export function nextStep(
  member: Pick<PageMember, "can">,
  state: { projects: { id: string; name: string }[]; awaiting: { id: string; partNumber: string }[] },
): NextStep {
  const latest = state.projects[0];
  if (!latest) {
    if (member.can("project.write"))
      return {
        text: "Nothing to check yet. Add the invented sample project to see a check, a comparison and a decision in a minute, or start your own.",
        sample: true,
      };
    return {
      text: "There are no projects yet. An engineer creates the project; you will find it under Projects.",
      link: { href: "/projects", label: "Open Projects" },
    };
  }
  if (member.can("part.verify") && state.awaiting.length > 0) {
    const part = state.awaiting[0];
    return {
      text: `${state.awaiting.length} library ${state.awaiting.length === 1 ? "part is still an unverified draft" : "parts are still unverified drafts"}. Check ${part.partNumber} against its datasheet and verify it before signing a decision that relies on it.`,
      link: { href: `/library/${part.id}`, label: `Verify ${part.partNumber}` },
    };
  }
  if (member.can("decision.sign"))
    return {
      text: `Compare the candidates of ${latest.name} across its fault cases and sign the decision.`,
      link: { href: `/projects/${latest.id}/compare`, label: "Compare and decide" },
    };
  if (member.can("project.write"))
    return {
      text: `See the verdicts of ${latest.name}, add fault cases or candidates, and run the check.`,
      link: { href: `/projects/${latest.id}`, label: `Open ${latest.name}` },
    };
  return {
    text: `Log what the bench measured for ${latest.name}: paste rows or upload a scope capture.`,
    link: { href: `/projects/${latest.id}?tab=bench`, label: "Log bench measurements" },
  };
}
