"use client";

import { type DragEvent, useState } from "react";

/**
 * A drop target for files: whether something is being dragged over it, and the handlers to spread
 * on the element. The browser's own handling (opening the file) is prevented.
 */
export function useFileDrop(onFiles: (files: FileList) => void) {
  const [dragging, setDragging] = useState(false);
  const dropProps = {
    onDragOver: (e: DragEvent) => {
      e.preventDefault();
      setDragging(true);
    },
    onDragLeave: () => setDragging(false),
    onDrop: (e: DragEvent) => {
      e.preventDefault();
      setDragging(false);
      onFiles(e.dataTransfer.files);
    },
  };
  return { dragging, dropProps };
}
