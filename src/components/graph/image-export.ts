// Downloads of a drawing: the SVG text as written, and a PNG rasterised from that same SVG, so the two exports and
// the palette they use cannot drift apart.
export { downloadBlob } from "@/lib/download";

export const svgBlob = (svg: string) => new Blob([svg], { type: "image/svg+xml" });

/** Rasterises an SVG document at `scale` device pixels per CSS pixel. */
export async function svgToPng(svg: string, scale = 2): Promise<Blob> {
  const url = URL.createObjectURL(svgBlob(svg));
  try {
    const image = new Image();
    image.src = url;
    await image.decode();
    const canvas = document.createElement("canvas");
    canvas.width = Math.ceil(image.naturalWidth * scale);
    canvas.height = Math.ceil(image.naturalHeight * scale);
    const ctx = canvas.getContext("2d");
    if (!ctx) throw new Error("This browser cannot draw on a canvas");
    ctx.scale(scale, scale);
    ctx.drawImage(image, 0, 0);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((b) => (b ? resolve(b) : reject(new Error("The PNG could not be made"))), "image/png"),
    );
  } finally {
    URL.revokeObjectURL(url);
  }
}
