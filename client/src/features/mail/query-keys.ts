export const mailKeys = {
  all: ['mail'] as const,
  list: () => [...mailKeys.all, 'list'] as const,
};
