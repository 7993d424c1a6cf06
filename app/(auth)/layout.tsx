import { LogoMark } from "@/components/brand/logo-mark";

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="mx-auto flex min-h-dvh w-full max-w-md flex-col justify-center gap-6 px-4 py-10">
      <div className="flex items-center gap-3">
        <LogoMark className="h-12 w-12" />
        <div>
          <p className="text-2xl font-bold tracking-tight text-ink-950">Placewright</p>
          <p className="text-sm text-muted">Placement and inspection log for structural concrete</p>
        </div>
      </div>
      {children}
    </main>
  );
}
