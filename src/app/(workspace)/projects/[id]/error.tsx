"use client";

import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";

export default function ProjectError(props: SegmentErrorProps) {
  return <SegmentError {...props} what="this project" />;
}
