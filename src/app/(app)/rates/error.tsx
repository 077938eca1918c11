"use client";

import { SegmentError } from "@/components/catalog/segment-error";

export default function RatesError(props: { error: Error & { digest?: string }; reset: () => void }) {
  return <SegmentError title="The rates could not be computed" {...props} />;
}
