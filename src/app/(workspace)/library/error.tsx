"use client";

import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";

export default function LibraryError(props: SegmentErrorProps) {
  return <SegmentError {...props} what="the part library" />;
}
