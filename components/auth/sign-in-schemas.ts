// The sign-in forms' checks, loaded on the first submit (lib/ui/lazy-resolver.ts): zod stays out of
// the sign-in page's first load.
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { emailField } from "@/lib/users/schemas";

export const passwordForm = z.object({ email: emailField, password: z.string().min(1, "Enter your password.") });
export const linkForm = z.object({ email: emailField });
export type PasswordValues = z.infer<typeof passwordForm>;
export type LinkValues = z.infer<typeof linkForm>;

export const passwordResolver = zodResolver(passwordForm);
export const linkResolver = zodResolver(linkForm);
