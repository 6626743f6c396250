"use client";
import { Button } from "@/components/ui/button";

export function PrintButton() {
  return (
    <Button variant="primary" className="no-print" onClick={() => window.print()}>
      Print the label
    </Button>
  );
}
