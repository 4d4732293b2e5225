import { KeyboardCode, type KeyboardCoordinateGetter } from "@dnd-kit/core";

/**
 * Keyboard dragging jumps a whole lane per arrow key (left/right) instead of nudging by pixels,
 * so a card can be carried from lane to lane with a few key presses.
 */
export const laneCoordinates: KeyboardCoordinateGetter = (event, { context, currentCoordinates }) => {
  if (event.code !== KeyboardCode.Right && event.code !== KeyboardCode.Left) return undefined;
  event.preventDefault();
  const lanes = [...context.droppableRects.entries()]
    .map(([id, rect]) => ({ id, rect }))
    .filter((l) => context.droppableContainers.get(l.id) !== undefined)
    .sort((a, b) => a.rect.left - b.rect.left);
  if (lanes.length === 0) return currentCoordinates;
  const x = currentCoordinates.x;
  const centre = (l: (typeof lanes)[number]) => l.rect.left + l.rect.width / 2;
  const next =
    event.code === KeyboardCode.Right ? lanes.find((l) => centre(l) > x + 4) : [...lanes].reverse().find((l) => centre(l) < x - 4);
  if (!next) return currentCoordinates;
  return { x: centre(next), y: Math.min(currentCoordinates.y, next.rect.top + 80) };
};
