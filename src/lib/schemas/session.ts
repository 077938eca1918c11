import { z } from "zod";

export const SignInSchema = z.object({
  email: z.email({ error: "Enter the e-mail address you sign in with." }).max(254),
  password: z.string({ error: "Enter your password." }).min(1, { error: "Enter your password." }).max(1024),
});
export type SignInInput = z.infer<typeof SignInSchema>;
