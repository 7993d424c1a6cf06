"use client";

import { Printer } from "lucide-react";
import { Button } from "@/components/ui/button";

export function PrintButton() {
  return (
    <Button className="no-print" data-testid="print-now" onClick={() => window.print()}>
      <Printer className="h-5 w-5" aria-hidden="true" /> Print
    </Button>
  );
}
