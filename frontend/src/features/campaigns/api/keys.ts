export const campaignKeys = {
  all: () => ['campaigns'] as const,
  list: () => [...campaignKeys.all(), 'list'] as const,
  detail: (id: number) => [...campaignKeys.all(), 'detail', id] as const,
};
