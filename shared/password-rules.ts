export const passwordMinLength = 10;
// bcrypt reads only the first 72 bytes, so a longer password would be silently shortened.
export const passwordMaxLength = 72;
