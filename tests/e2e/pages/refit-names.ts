/** The refit browser test's data (created by refit-fixture.ts). */
export const E2E_REFIT = { slug: "e2e-diamond", title: "E2E diamond sp3s*", proposal: "E2E refit" } as const;
