import "server-only";

/** The address people use to reach Meniscus; links in e-mails start with it. */
export function appUrl(): string {
  const url = process.env.APP_URL || process.env.NEXTAUTH_URL || `http://localhost:${process.env.PORT || 3000}`;
  return url.replace(/\/+$/, "");
}

/** Set MENISCUS_ENV=production on a real deployment: secrets must then come from the environment. */
export function isProductionDeployment(): boolean {
  return process.env.MENISCUS_ENV === "production";
}

export const MAIL_FROM = () => process.env.MAIL_FROM || "Meniscus <no-reply@meniscus.invalid>";
