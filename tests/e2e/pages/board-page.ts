import { expect, type Locator, type Page } from "@playwright/test";

export class BoardPage {
  constructor(private readonly page: Page) {}

  async goto() {
    await this.page.goto("/board?family=e2e-chain");
    await this.ready();
  }

  async ready() {
    await expect(this.page.locator("[data-board-ready=true]")).toBeAttached();
  }

  lane(stage: string): Locator {
    return this.page.getByTestId(`lane-${stage}`);
  }

  card(title: string): Locator {
    return this.page.getByRole("article", { name: new RegExp(`^${title},`) });
  }

  handle(title: string): Locator {
    return this.card(title).getByRole("button", { name: `Drag ${title}` });
  }

  notice(): Locator {
    return this.page.getByTestId("board-notice");
  }

  /** A real pointer drag in small steps, as a person does it. */
  async dragWithMouse(title: string, stage: string) {
    await this.ready();
    await this.handle(title).scrollIntoViewIfNeeded();
    const from = await this.handle(title).boundingBox();
    const to = await this.lane(stage).boundingBox();
    if (!from || !to) throw new Error("card or lane not on screen");
    // Lanes are equally tall, so a horizontal drag at the card's height ends inside the target lane.
    const y = from.y + from.height / 2;
    const startX = from.x + from.width / 2;
    const targetX = to.x + to.width / 2;
    await this.page.mouse.move(startX, y);
    await this.page.mouse.down();
    for (let i = 1; i <= 12; i++) await this.page.mouse.move(startX + ((targetX - startX) * i) / 12, y);
    await expect(this.lane(stage)).not.toHaveAttribute("data-lane-state", "idle");
    await this.page.mouse.up();
  }

  /** Pick up with Space, carry with arrow keys, drop with Space; each step waits for the board to respond. */
  async dragWithKeyboard(title: string, from: string, to: string, lanesRight: number) {
    await this.ready();
    await this.handle(title).focus();
    await this.page.keyboard.press("Space");
    await expect(this.lane(from)).toHaveAttribute("data-lane-state", "origin");
    for (let i = 0; i < lanesRight; i++) await this.page.keyboard.press("ArrowRight");
    await expect(this.page.getByText(`Over the ${to} lane.`)).toBeAttached();
    await this.page.keyboard.press("Space");
  }
}
