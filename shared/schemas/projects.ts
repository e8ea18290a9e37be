// Payloads for projects, memberships, invitations and the audit log.
import { z } from "zod";
import { CAPABILITIES, PROJECT_ROLES, SITE_ROLES } from "../types/roles";
import { DisplayName, Email, NAME_MAX, NewPassword } from "./accounts";

export const ProjectName = z
  .string()
  .trim()
  .min(1, { message: "Enter a project name" })
  .max(NAME_MAX, { message: `A project name has at most ${NAME_MAX} characters` });

export const ProjectRoleSchema = z.enum(PROJECT_ROLES);

/** Every route under /api/projects/:projectId. */
export const ProjectParams = z.object({ projectId: z.string().uuid() });

export const MemberParams = z.object({
  projectId: z.string().uuid(),
  userId: z.string().uuid({ message: "Not a member id" }),
});
export const InvitationParams = z.object({
  projectId: z.string().uuid(),
  invitationId: z.string().uuid({ message: "Not an invitation id" }),
});
export const TokenParams = z.object({
  token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, { message: "This invitation link is malformed" }),
});

export const Project = z.object({
  id: z.string().uuid(),
  name: z.string(),
  description: z.string(),
  archived: z.boolean(),
  archivedAt: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Project = z.infer<typeof Project>;

export const ProjectListItem = Project.extend({ role: ProjectRoleSchema.nullable(), memberCount: z.number().int() });
export type ProjectListItem = z.infer<typeof ProjectListItem>;

/** One project as the caller sees it: their role and what it lets them do, so the client can hide the rest. */
export const ProjectDetail = Project.extend({
  role: ProjectRoleSchema.nullable(),
  siteRole: z.enum(SITE_ROLES),
  capabilities: z.array(z.enum(CAPABILITIES)),
});
export type ProjectDetail = z.infer<typeof ProjectDetail>;

export const CreateProjectBody = z.object({ name: ProjectName, description: z.string().trim().max(2000).default("") });
export type CreateProjectBody = z.input<typeof CreateProjectBody>;

export const UpdateProjectBody = z
  .object({
    name: ProjectName.optional(),
    description: z.string().trim().max(2000).optional(),
    archived: z.boolean().optional(),
  })
  .refine((b) => b.name !== undefined || b.description !== undefined || b.archived !== undefined, {
    message: "Nothing to change",
  });
export type UpdateProjectBody = z.infer<typeof UpdateProjectBody>;

export const DeleteProjectBody = z.object({ confirmName: z.string().max(500) });
export type DeleteProjectBody = z.infer<typeof DeleteProjectBody>;

export const Member = z.object({
  userId: z.string().uuid(),
  email: z.string(),
  displayName: z.string(),
  siteRole: z.enum(SITE_ROLES),
  role: ProjectRoleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof Member>;

export const ChangeRoleBody = z.object({ role: ProjectRoleSchema });
export type ChangeRoleBody = z.infer<typeof ChangeRoleBody>;

export const CreateInvitationBody = z.object({ email: Email, role: ProjectRoleSchema });
export type CreateInvitationBody = z.input<typeof CreateInvitationBody>;

export const Invitation = z.object({
  id: z.string().uuid(),
  projectId: z.string().uuid(),
  email: z.string(),
  role: ProjectRoleSchema,
  invitedByName: z.string(),
  expiresAt: z.string(),
  createdAt: z.string(),
});
export type Invitation = z.infer<typeof Invitation>;

/** What the invitee sees before accepting: enough to decide, nothing about the project beyond its name. */
export const InvitationPreview = z.object({
  projectName: z.string(),
  email: z.string(),
  role: ProjectRoleSchema,
  invitedByName: z.string(),
  expiresAt: z.string(),
  accountExists: z.boolean(),
});
export type InvitationPreview = z.infer<typeof InvitationPreview>;

/** A new account needs a name and a password; someone who already has an account signs in first and sends {}. */
export const AcceptInvitationBody = z.object({ displayName: DisplayName.optional(), password: NewPassword.optional() });
export type AcceptInvitationBody = z.infer<typeof AcceptInvitationBody>;

export const AcceptedInvitation = z.object({ projectId: z.string().uuid(), role: ProjectRoleSchema });
export type AcceptedInvitation = z.infer<typeof AcceptedInvitation>;

export const AuditEntry = z.object({
  id: z.string(),
  projectId: z.string().uuid(),
  actorId: z.string().uuid().nullable(),
  actorName: z.string(),
  action: z.string(),
  target: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
  createdAt: z.string(),
});
export type AuditEntry = z.infer<typeof AuditEntry>;

export const AuditQuery = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(50),
  before: z
    .string()
    .regex(/^\d{1,18}$/)
    .optional(),
});
