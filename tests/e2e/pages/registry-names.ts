/** The registry's browser-test family and proposal (seeded by registry-fixture.ts); no imports, so the seed can use it. */
export const E2E_REGISTRY = { slug: "e2e-registry", title: "E2E registry chain", proposal: "E2E release candidate" };
