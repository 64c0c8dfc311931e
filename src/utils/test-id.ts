/** `data-testid` for Naive UI's `input-props`, whose type does not list data attributes. */
export const testId = (id: string): Record<string, string> => ({ 'data-testid': id })
