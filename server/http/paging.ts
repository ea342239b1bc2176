/** Escapes `%`, `_` and `\` for a LIKE pattern with ESCAPE '\'. */
export const likeContains = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
