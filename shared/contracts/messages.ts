/**
 * The `error` option of a zod schema whose type is wrong: "is required" when the field is missing, else the
 * expected kind (`must be a finite number`). Other issues of the same schema (an unknown key of a strict object,
 * say) keep their own message. Used by every compute contract, so all commands word their refusals alike.
 */
export const typeError = (expected: string) => (issue: { code?: string; input?: unknown }) =>
  issue.code === undefined || issue.code === 'invalid_type' || issue.code === 'invalid_value' || issue.code === 'invalid_union'
    ? issue.input === undefined
      ? 'is required'
      : expected
    : undefined;
