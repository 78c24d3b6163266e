// Lets server-only modules be imported by vitest (outside the Next.js bundler).
export {};
