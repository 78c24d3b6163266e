import { env } from "@/lib/env";

const base = () => env.APP_URL.replace(/\/$/, "");
export const invitationUrl = (token: string) => `${base()}/invite/${token}`;
export const passwordResetUrl = (token: string) => `${base()}/reset-password/${token}`;
