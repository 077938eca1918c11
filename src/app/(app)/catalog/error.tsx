"use client";

import { SegmentError } from "@/components/catalog/segment-error";

export default function CatalogError(props: { error: Error & { digest?: string }; reset: () => void }) {
  return <SegmentError title="The catalog could not be shown" {...props} />;
}
