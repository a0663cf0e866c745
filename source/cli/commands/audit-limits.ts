/** Records listed in full by default; a larger audit is summarised unless --all asks for every record. */
export const listAllUpTo = 20;

/** Records audited before a progress line is worth showing. */
export const progressAbove = 1000;
