import clsx from "clsx";
import { forwardRef } from "react";

type Variant = "primary" | "secondary" | "ghost" | "danger";

const VARIANTS: Record<Variant, string> = {
  primary: "bg-lichen-700 text-white hover:bg-lichen-800 focus-visible:outline-lichen-700",
  secondary: "bg-white text-ink-900 border border-ink-300 hover:bg-ink-50 focus-visible:outline-ink-700",
  ghost: "text-ink-800 hover:bg-ink-100 focus-visible:outline-ink-700",
  danger: "bg-danger-700 text-white hover:bg-danger-800 focus-visible:outline-danger-700",
};

export type ButtonProps = React.ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; block?: boolean };

/** Touch-sized (48 px) by default: usable with gloves. */
export const Button = forwardRef<HTMLButtonElement, ButtonProps>(function Button(
  { variant = "primary", block, className, type = "button", ...props },
  ref,
) {
  return (
    <button
      ref={ref}
      type={type}
      className={clsx(
        "inline-flex min-h-touch items-center justify-center gap-2 rounded-lg px-4 text-base font-semibold",
        "focus-visible:outline-2 focus-visible:outline-offset-2 disabled:cursor-not-allowed disabled:opacity-50",
        VARIANTS[variant],
        block && "w-full",
        className,
      )}
      {...props}
    />
  );
});
