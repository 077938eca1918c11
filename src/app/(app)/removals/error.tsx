"use client";

import { SegmentError } from "@/components/catalog/segment-error";

export default function RemovalsError(props: { error: Error & { digest?: string }; reset: () => void }) {
  return <SegmentError title="The removals could not be shown" {...props} />;
}
