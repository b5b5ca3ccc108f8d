export const adminKeys = {
  all: () => ['admin'] as const,
  users: () => [...adminKeys.all(), 'users'] as const,
  mail: () => [...adminKeys.all(), 'mail'] as const,
  mailMessage: (id: number) => [...adminKeys.mail(), id] as const,
};
