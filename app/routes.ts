import { type RouteConfig, index, prefix, route } from "@react-router/dev/routes";

export default [
  index("routes/home.tsx"),
  route("quick-sizing", "routes/quick-sizing.tsx"),
  route("sign-in", "routes/sign-in.tsx"),
  route("sign-up", "routes/sign-up.tsx"),
  route("sign-out", "routes/sign-out.tsx"),
  route("forgot-password", "routes/forgot-password.tsx"),
  route("reset-password/:token", "routes/reset-password.tsx"),
  route("join/:token", "routes/join.tsx"),
  route("specs", "routes/specs.tsx"),
  route("specs/:specId/attachments", "routes/spec-attachments.tsx"),
  route("specs/:specId/attachments/:attachmentId", "routes/spec-attachment-download.ts"),
  route("specs/new", "routes/spec-new.tsx"),
  route("specs/:specId", "routes/spec.tsx"),
  route("specs/:specId/edit", "routes/spec-resume.tsx"),
  route("specs/:specId/edit/:step", "routes/spec-step.tsx"),
  route("specs/:specId/delete", "routes/spec-delete.tsx"),
  route("open-specs", "routes/open-specs.tsx"),
  route("settings", "routes/settings.tsx"),
  route("team", "routes/team.tsx"),
  route("team/invitations/:invitationId/revoke", "routes/team.revoke-invitation.tsx"),
  route("accounts", "routes/accounts.tsx"),
  route("accounts/:organisationId", "routes/account.tsx"),
  ...prefix("api/v1", [
    route("sizing", "routes/api.v1.sizing.ts"),
    route("health", "routes/api.v1.health.ts"),
  ]),
  ...prefix("admin", [
    route("users", "routes/admin.users.tsx"),
    route("organisations", "routes/admin.organisations.tsx"),
  ]),
] satisfies RouteConfig;
