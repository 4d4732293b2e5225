import { describe, expect, it } from "vitest";
import { changeRolesInput, inviteInput, resetPasswordInput } from "@/lib/accounts/schemas";
import { formDataToObject, fieldErrorsOf } from "@/lib/action";
import { AppError, httpStatusOf, toErrorResponse } from "@/lib/errors";

describe("form data", () => {
  it("turns repeated keys into arrays and skips framework fields", () => {
    const form = new FormData();
    form.append("roles", "author");
    form.append("roles", "reviewer");
    form.append("name", "A");
    form.append("$ACTION_ID_abc", "");
    expect(formDataToObject(form)).toEqual({ roles: ["author", "reviewer"], name: "A" });
  });
});

describe("account inputs", () => {
  it("accepts a single checked role as a list and lower-cases the e-mail", () => {
    const parsed = inviteInput.parse({ email: " Someone@Example.ORG ", name: "Someone", roles: "reviewer" });
    expect(parsed).toEqual({ email: "someone@example.org", name: "Someone", roles: ["reviewer"] });
  });
  it("names each bad field", () => {
    const result = inviteInput.safeParse({ email: "not-an-address", name: "", roles: ["wizard"] });
    expect(result.success).toBe(false);
    const errors = fieldErrorsOf(result.error!);
    expect(Object.keys(errors).sort()).toEqual(["email", "name", "roles.0"]);
  });
  it("requires at least one role for an invitation but allows none when editing", () => {
    expect(inviteInput.safeParse({ email: "a@b.org", name: "A" }).success).toBe(false);
    expect(changeRolesInput.safeParse({ userId: "5d2b7c0e-8f0a-4c8e-9a51-3f0e2b9f1a11", version: "3" }).success).toBe(true);
  });
  it("refuses short or mismatched passwords", () => {
    const short = resetPasswordInput.safeParse({ token: "x".repeat(43), password: "short", confirm: "short" });
    expect(fieldErrorsOf(short.error!).password).toBeDefined();
    const differ = resetPasswordInput.safeParse({ token: "x".repeat(43), password: "long-enough-1", confirm: "long-enough-2" });
    expect(fieldErrorsOf(differ.error!).confirm).toEqual(["The two passwords differ."]);
  });
});

describe("error vocabulary", () => {
  it("maps kinds to HTTP statuses", () => {
    expect(httpStatusOf("unauthenticated:session")).toBe(401);
    expect(httpStatusOf("forbidden:role")).toBe(403);
    expect(httpStatusOf("conflict:stale")).toBe(409);
    expect(httpStatusOf("rate-limited:sign-in")).toBe(429);
  });
  it("shows AppError messages and hides everything else", () => {
    expect(toErrorResponse(new AppError("forbidden:admin", "Only an admin may do this.")).body.error.message).toBe("Only an admin may do this.");
    const hidden = toErrorResponse(new Error("duplicate key value violates unique constraint users_email_key"));
    expect(hidden.status).toBe(500);
    expect(hidden.body.error.message).not.toMatch(/users_email_key/);
  });
});
