import { CrumbLink } from "@/components/library/title-bar";

/** "Projects / <project>": the start of the title bar's context on the pages inside a project. */
export function ProjectTrail({ project }: { project: { id: string; name: string } }) {
  return (
    <>
      <CrumbLink href="/projects">Projects</CrumbLink>
      {" / "}
      <CrumbLink href={`/projects/${project.id}`}>{project.name}</CrumbLink>
    </>
  );
}
