export const invitationKeys = {
  all: () => ['invitations'] as const,
  detail: (token: string) => [...invitationKeys.all(), token] as const,
};
