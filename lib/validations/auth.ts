import { z } from "zod";

export const signInSchema = z.object({
  email: z.string().trim().min(1, "Enter your e-mail address.").email("Enter a valid e-mail address."),
  password: z.string().min(1, "Enter your password."),
});
export type SignInInput = z.infer<typeof signInSchema>;
