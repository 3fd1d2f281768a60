/** Sizes shared with _lane-size.scss: the drag maths finds the lane under the pointer from them. */
export const LANE_HEIGHT_PX = 92;
export const LANE_HEADER_PX = 172;
