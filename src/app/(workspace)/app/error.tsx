"use client";

import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";

export default function OverviewError(props: SegmentErrorProps) {
  return <SegmentError {...props} what="the overview" />;
}
