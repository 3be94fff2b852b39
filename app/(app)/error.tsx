"use client";

import { ErrorState } from "@/components/ui/states";

export default function SignedInError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <ErrorState
      title="This page could not be shown."
      message={`Nothing you saved was lost. Try again${error.digest ? ` (reference ${error.digest})` : ""}.`}
      onRetry={reset}
    />
  );
}
