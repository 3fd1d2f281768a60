/** Sizes shared with _lane-size.scss: the drag maths finds the lane under the pointer from them. */
export const LANE_HEIGHT_PX = 104;
export const LANE_HEADER_PX = 172;
/** The time axis above the lanes, sticky at the scroller's top. */
export const LANE_HEADER_AXIS_PX = 34;
