import sharp from "sharp";
const [src, top, height, out] = process.argv.slice(2);
const meta = await sharp(src).metadata();
await sharp(src).extract({ left: 0, top: Number(top), width: meta.width, height: Math.min(Number(height), meta.height - Number(top)) }).toFile(out);
