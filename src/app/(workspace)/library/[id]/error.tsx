"use client";

import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";

export default function PartError(props: SegmentErrorProps) {
  return <SegmentError {...props} what="this part" />;
}
