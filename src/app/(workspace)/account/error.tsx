"use client";

import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";

export default function AccountError(props: SegmentErrorProps) {
  return <SegmentError {...props} what="your account" />;
}
