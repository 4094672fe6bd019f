// Converters for react-hook-form `setValueAs`: form inputs hold text, the shared schemas want numbers.

/** '' and non-numbers become NaN, which the schema reports as "must be a number". */
export const toNumber = (value: unknown): number => (value === '' || value === null || value === undefined ? Number.NaN : Number(value));

/** '' becomes null, for optional figures such as a shop-test SFOC point that was not measured. */
export const toNumberOrNull = (value: unknown): number | null => (value === '' || value === null || value === undefined ? null : Number(value));

/** Parse-time messages for the shared schemas when a number field holds no number. */
export const numberFieldMessages = {
  error: (issue: { code?: string; expected?: unknown }) =>
    issue.code === 'invalid_type' && issue.expected === 'number' ? 'Enter a number' : undefined,
};
