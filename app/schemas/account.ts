import { z } from "zod";

// Shared by the server actions and the Conform forms: one set of rules for account fields.
const trimmed = (max: number, label: string) =>
  z
    .string({ error: `Enter your ${label}.` })
    .trim()
    .min(1, `Enter your ${label}.`)
    .max(max, `Keep the ${label} under ${max + 1} characters.`);

const emailField = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .min(1, "Enter an e-mail address.")
  .max(254, "That e-mail address is too long.")
  .pipe(z.email("Enter an e-mail address like name@company.com."))
  .transform((v) => v.toLowerCase());

const newPasswordField = z.string({ error: "Choose a password." }).min(10, "Use at least 10 characters.").max(72, "Use at most 72 characters."); // bcrypt reads only the first 72 bytes

/** The signed-in person's own password, asked again before a refund or a role change. */
export const currentPasswordField = z
  .string({ error: "Enter your password to confirm." })
  .min(1, "Enter your password to confirm.")
  .max(200, "That is not your password.");

export const signInSchema = z.object({
  email: emailField,
  password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(200),
  redirectTo: z.string().optional(),
});

export const signUpSchema = z.object({
  kind: z.enum(["buyer", "shop"], { error: "Say whether you build machines or hydraulic systems." }),
  organisationName: trimmed(120, "company name"),
  name: trimmed(120, "name"),
  email: emailField,
  password: newPasswordField,
});

export const forgotPasswordSchema = z.object({ email: emailField });

export const resetPasswordSchema = z
  .object({
    password: newPasswordField,
    confirm: z.string({ error: "Type the new password again." }),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ." });

export const inviteSchema = z.object({
  email: emailField,
  role: z.enum(["buyer", "shop", "account_manager", "admin"]).optional(),
});

export const acceptInvitationSchema = z.object({
  name: trimmed(120, "name"),
  password: newPasswordField,
});

export const settingsSchema = z.object({
  name: trimmed(120, "name"),
  unitSystem: z.enum(["metric", "us"], { error: "Choose the units you work in." }),
});
