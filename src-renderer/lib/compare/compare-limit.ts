/** The most builds a comparison shows side by side: more would not fit a printed page. */
export const MAX_COMPARED = 4;
