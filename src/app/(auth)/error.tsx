"use client";

import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";

export default function AuthError(props: SegmentErrorProps) {
  return <SegmentError {...props} what="this page" />;
}
