"use client";

import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";

export default function ProjectsError(props: SegmentErrorProps) {
  return <SegmentError {...props} what="the projects" />;
}
