/**
 * Size of each part on the canvas and where its pins sit: the one geometry lives in shared/render (the
 * board pictures draw from it too); the canvas takes it from there.
 */
export {
  GRID, noteShape, placedShape, rotatePoint, rotateSide, rotationTransform, shapeOf, snap,
  type PartShape, type PinSpot, type Rotation, type Side,
} from '../../../../shared/render';
