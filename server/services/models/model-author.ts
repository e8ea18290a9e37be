// Who writes a model and where: the project it belongs to and the account named as its author and in the audit log.
export interface ModelAuthor {
  projectId: string;
  userId: string;
}
