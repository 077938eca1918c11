"use client";

import { SegmentError } from "@/components/catalog/segment-error";

export default function LayoutsError(props: { error: Error & { digest?: string }; reset: () => void }) {
  return <SegmentError title="The layout could not be shown" {...props} />;
}
