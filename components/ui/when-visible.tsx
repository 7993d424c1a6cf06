"use client";

import { useEffect, useRef, useState } from "react";

/**
 * Renders `children` once this box comes near the screen (within `margin`), `placeholder` before.
 * For drawings below the fold whose code is heavy (recharts, about 115 KB gzipped): a phone on a
 * weak signal loads them when the user scrolls to them, not with the page. Give the placeholder
 * the drawing's height so nothing moves when it arrives. The service worker precaches the chunk,
 * so the drawing also appears offline.
 */
export function WhenVisible({
  children,
  placeholder,
  margin = "200px",
  className,
  testId,
}: {
  children: React.ReactNode;
  placeholder: React.ReactNode;
  margin?: string;
  className?: string;
  testId?: string;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const [near, setNear] = useState(false);
  useEffect(() => {
    const box = ref.current;
    if (near || !box) return;
    const observer = new IntersectionObserver((entries) => {
      if (entries.some((entry) => entry.isIntersecting)) setNear(true);
    }, { rootMargin: margin });
    observer.observe(box);
    return () => observer.disconnect();
  }, [near, margin]);
  return (
    <div ref={ref} className={className} data-testid={testId}>
      {near ? children : placeholder}
    </div>
  );
}
