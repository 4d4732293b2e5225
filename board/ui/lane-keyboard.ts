import { closestCenter, KeyboardCode, pointerWithin, type CollisionDetection, type KeyboardCoordinateGetter } from "@dnd-kit/core";

/**
 * Keyboard dragging jumps a whole lane per arrow key (left/right) instead of nudging by pixels, so a card can be
 * carried from lane to lane with a few key presses. Coordinates are the dragged card's top-left corner.
 */
export const laneCoordinates: KeyboardCoordinateGetter = (event, { context, currentCoordinates }) => {
  if (event.code !== KeyboardCode.Right && event.code !== KeyboardCode.Left) return undefined;
  event.preventDefault();
  const width = context.collisionRect?.width ?? 0;
  const lanes = [...context.droppableRects.values()].sort((a, b) => a.left - b.left);
  const cardCentre = currentCoordinates.x + width / 2;
  const centre = (r: (typeof lanes)[number]) => r.left + r.width / 2;
  const next =
    event.code === KeyboardCode.Right ? lanes.find((r) => centre(r) > cardCentre + 4) : [...lanes].reverse().find((r) => centre(r) < cardCentre - 4);
  if (!next) return currentCoordinates;
  return { x: centre(next) - width / 2, y: Math.max(next.top + 48, Math.min(currentCoordinates.y, next.top + 96)) };
};

/** The lane under the pointer; for keyboard drags (no pointer), the lane nearest the card. */
export const laneCollision: CollisionDetection = (args) => {
  const hits = args.pointerCoordinates ? pointerWithin(args) : [];
  return hits.length > 0 ? hits : closestCenter(args);
};
