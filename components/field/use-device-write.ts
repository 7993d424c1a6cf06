"use client";

import { useState } from "react";
import { writeErrorOf } from "./write-error";

/** A save on this device: clears the last error, runs the write, and keeps its message when it fails. */
export function useDeviceWrite() {
  const [error, setError] = useState<string | null>(null);
  const run = async (write: () => Promise<unknown>) => {
    setError(null);
    try {
      await write();
    } catch (e) {
      setError(writeErrorOf(e).message);
    }
  };
  return { error, run };
}
