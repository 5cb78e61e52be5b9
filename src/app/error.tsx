"use client";

import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";

export default function RootError(props: SegmentErrorProps) {
  return <SegmentError {...props} what="this page" />;
}
