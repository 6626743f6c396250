"use client";
import { Button } from "@/components/ui/button";

export default function AppError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="card max-w-xl space-y-3 p-6" role="alert">
      <h1 className="text-xl font-semibold">This page could not be shown</h1>
      <p className="text-sm text-ink-muted">
        Something went wrong on the server while preparing it. Nothing you entered was lost. Try again; if it keeps happening, give
        your admin this reference: <code className="num">{error.digest ?? "none"}</code>.
      </p>
      <Button variant="primary" onClick={reset}>
        Try again
      </Button>
    </div>
  );
}
