// The build's `loader: {".svg": "text"}` (and the jest preset) hand us an SVG file's markup as a string.
declare module '*.svg' {
  const markup: string;
  export default markup;
}
