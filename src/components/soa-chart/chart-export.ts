// Export of a drawn chart: the <svg> as it is on screen (hover aids left out, CSS variables replaced by their
// values, a background and a font set), saved as SVG, or drawn on a canvas at twice the size and saved as PNG.

const colourAttributes = ["fill", "stroke", "color", "stop-color"];

/** A standalone SVG document of the chart. */
export function serializeChart(svg: SVGSVGElement): { text: string; width: number; height: number } {
  const { width, height } = svg.getBoundingClientRect();
  const clone = svg.cloneNode(true) as SVGSVGElement;
  for (const skip of clone.querySelectorAll("[data-export='skip']")) skip.remove();
  const root = getComputedStyle(document.documentElement);
  const resolve = (value: string) =>
    value.replace(
      /var\((--[\w-]+)\)/g,
      (_, name: string) => root.getPropertyValue(name).trim() || "currentColor",
    );
  for (const element of [clone, ...clone.querySelectorAll("*")]) {
    for (const name of colourAttributes) {
      const value = element.getAttribute(name);
      if (value?.includes("var(")) element.setAttribute(name, resolve(value));
    }
    const style = element.getAttribute("style");
    if (style?.includes("var(")) element.setAttribute("style", resolve(style));
  }
  clone.setAttribute("xmlns", "http://www.w3.org/2000/svg");
  clone.setAttribute("width", String(Math.round(width)));
  clone.setAttribute("height", String(Math.round(height)));
  clone.setAttribute("viewBox", `0 0 ${Math.round(width)} ${Math.round(height)}`);
  const font = getComputedStyle(svg).fontFamily;
  clone.setAttribute("font-family", `${font}, Helvetica, Arial, sans-serif`);
  const background = document.createElementNS("http://www.w3.org/2000/svg", "rect");
  background.setAttribute("width", "100%");
  background.setAttribute("height", "100%");
  background.setAttribute("fill", resolve("var(--color-panel)"));
  clone.insertBefore(background, clone.firstChild);
  const text = `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(clone)}`;
  return { text, width, height };
}

export function downloadSvg(svg: SVGSVGElement, fileName: string): void {
  const { text } = serializeChart(svg);
  download(new Blob([text], { type: "image/svg+xml" }), `${fileName}.svg`);
}

export async function downloadPng(svg: SVGSVGElement, fileName: string, scale = 2): Promise<void> {
  const { text, width, height } = serializeChart(svg);
  const image = new Image();
  image.decoding = "sync";
  const loaded = new Promise<void>((resolve, reject) => {
    image.onload = () => resolve();
    image.onerror = () => reject(new Error("The chart could not be drawn as an image."));
  });
  image.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(text)}`;
  await loaded;
  const canvas = document.createElement("canvas");
  canvas.width = Math.round(width * scale);
  canvas.height = Math.round(height * scale);
  const context = canvas.getContext("2d");
  if (!context) throw new Error("This browser cannot draw on a canvas.");
  context.scale(scale, scale);
  context.drawImage(image, 0, 0, width, height);
  const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, "image/png"));
  if (!blob) throw new Error("The PNG could not be made.");
  download(blob, `${fileName}.png`);
}

function download(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement("a");
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
