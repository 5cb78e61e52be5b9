"use client";

import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";

export default function TeamError(props: SegmentErrorProps) {
  return <SegmentError {...props} what="the team" />;
}
