"use client";

import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";

export default function DecisionsError(props: SegmentErrorProps) {
  return <SegmentError {...props} what="the decisions" />;
}
