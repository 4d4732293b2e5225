import { afterAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { appUrl, HttpSession } from "../support/http-session";
import { createPerson } from "../support/people";

afterAll(closeDb);

/** Where a browser goes on this answer, or null when it does not redirect. */
function landing(res: Response): URL | null {
  const location = res.headers.get("location");
  return location === null ? null : new URL(location, `${appUrl()}/login`);
}

async function signedIn(): Promise<HttpSession> {
  return (await personSignedIn()).session;
}

async function personSignedIn() {
  const person = await createPerson(["author"]);
  const session = new HttpSession(appUrl());
  expect(await session.signIn(person.email, person.password)).toBeNull();
  return { person, session };
}

const origin = () => new URL(appUrl()).origin;

describe("the place to return to after signing in", () => {
  const malformed = ["/a%0d%0ab", "%0d%0aSet-Cookie:%20x=1", "/%0aevil", "/%00x"];

  it("answers CR, LF and NUL in callbackUrl with a redirect home, never a 500, on the sign-in page", async () => {
    const session = await signedIn();
    for (const raw of malformed) {
      const res = await session.fetch(`/login?callbackUrl=${raw}`);
      expect(res.status, raw).toBeLessThan(500);
      // An address holding %00 is refused (400) before any page runs; the others send the signed-in person home.
      if (raw.includes("%00")) expect(res.status, raw).toBe(400);
      else expect(landing(res)?.href, raw).toBe(`${origin()}/`);
    }
    const repeated = await session.fetch("/login?callbackUrl=/a&callbackUrl=/b");
    expect(repeated.status).toBeLessThan(500);
    expect(landing(repeated)?.origin).toBe(origin());
  });

  it("answers them without a 500 on next-auth's own endpoints, and sends the browser only to this site", async () => {
    const { person, session } = await personSignedIn();
    for (const raw of [...malformed, "https://evil.example/", "/%09/evil.example/phish", "//evil.example"]) {
      const res = await new HttpSession(appUrl()).fetch(`/api/auth/signin?callbackUrl=${raw}`);
      expect(res.status, raw).toBeLessThan(500);
      if (raw.includes("%00")) expect(res.status, raw).toBe(400);
      else expect(landing(res)?.origin, raw).toBe(origin());

      const { csrfToken } = (await (await session.fetch("/api/auth/csrf")).json()) as { csrfToken: string };
      const post = await session.fetch("/api/auth/callback/credentials", {
        method: "POST",
        headers: { "content-type": "application/x-www-form-urlencoded" },
        body: `csrfToken=${csrfToken}&email=${encodeURIComponent(person.email)}&password=${person.password}&callbackUrl=${raw}`,
      });
      expect(post.status, raw).toBeLessThan(500);
      expect(landing(post)?.origin, raw).toBe(origin());
    }
  });

  it("sends the browser home after signing out whatever callbackUrl asks", async () => {
    const session = await signedIn();
    expect(new URL(await session.signOut("https://evil.example/after")).origin).toBe(origin());
  });
});
