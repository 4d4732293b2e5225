import type { HttpSession } from "@/tests/support/http-session";
import type { ManagedProcess } from "./processes";
import type { WebhookReceiver } from "./receiver";
import type { World } from "./world";

/** What the phases share: the running processes (replaced when restarted), the webhook receiver, the seeded data. */
export interface Rig {
  web: ManagedProcess;
  worker: ManagedProcess;
  receiver: WebhookReceiver;
  world: World;
  /** The board world's author and the fit world's author, signed in over HTTP. */
  author: HttpSession;
  fitAuthor: HttpSession;
}
