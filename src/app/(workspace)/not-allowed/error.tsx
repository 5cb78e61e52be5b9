"use client";

import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";

export default function NotAllowedError(props: SegmentErrorProps) {
  return <SegmentError {...props} what="this page" />;
}
