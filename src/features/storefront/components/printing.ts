// Printing a page whose photos load lazily: every image is asked for first, so the paper copy has the cover, the
// photos with their pins and the close-ups, not empty boxes.

/** Turns every lazy image eager (printing is the one time a buyer wants them all). */
export function loadEveryImage(): HTMLImageElement[] {
  const images = [...document.images];
  for (const img of images) if (img.loading === "lazy") img.loading = "eager";
  return images;
}

/** Prints once the images have loaded, or after a few seconds whatever happened (a slow photo never blocks printing). */
export async function printWithImages(timeoutMs = 4000): Promise<void> {
  const pending = loadEveryImage().filter((img) => !img.complete);
  await Promise.race([
    Promise.all(
      pending.map(
        (img) =>
          new Promise<void>((resolve) => {
            img.addEventListener("load", () => resolve(), { once: true });
            img.addEventListener("error", () => resolve(), { once: true });
          }),
      ),
    ),
    new Promise<void>((resolve) => setTimeout(resolve, timeoutMs)),
  ]);
  window.print();
}
