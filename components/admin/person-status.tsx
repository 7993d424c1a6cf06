"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { callApi } from "@/lib/api/client";

/** Disable (signs the person out everywhere; their records and signatures stay) or enable again. */
export function PersonStatus({ id, name, disabled, self }: { id: string; name: string; disabled: boolean; self: boolean }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const toggle = async () => {
    if (!disabled && !window.confirm(`Disable ${name}? They are signed out everywhere and cannot sign in or sync. Their records and signatures stay.`)) return;
    const result = await callApi(`/api/admin/users/${id}/status`, { body: { disabled: !disabled } });
    if (!result.ok) return setError(result.error.message);
    setError(null);
    router.refresh();
  };
  if (self) return null;
  return (
    <div className="flex flex-col items-start gap-1">
      <Button variant={disabled ? "secondary" : "ghost"} className="min-h-11 px-3 text-sm" onClick={toggle} data-testid={`person-status-${id}`}>
        {disabled ? "Enable" : "Disable"}
      </Button>
      {error ? <p role="alert" className="text-sm text-danger-800">{error}</p> : null}
    </div>
  );
}
