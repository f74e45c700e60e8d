/** The roles an owner can give (ownership itself is not handed over here). */
export const ROLE_OPTIONS = [
  { value: 'editor', label: 'Editor' },
  { value: 'viewer', label: 'Viewer' },
] as const;
