import "server-only";
import path from "node:path";

/**
 * Full TTFs (Latin and Greek) from the @expo-google-fonts packages: subset web
 * fonts lack glyphs such as Ω and µ and would fall back silently (checked with pdffonts and pdftotext).
 * Resolved from the working directory, where `next start` and the tests run.
 */
const root = path.join(process.cwd(), "node_modules", "@expo-google-fonts");

export const SANS_FAMILY = "Source Sans 3";
export const MONO_FAMILY = "Source Code Pro";

export const fontFiles = {
  sansRegular: path.join(root, "source-sans-3", "400Regular", "SourceSans3_400Regular.ttf"),
  sansItalic: path.join(root, "source-sans-3", "400Regular_Italic", "SourceSans3_400Regular_Italic.ttf"),
  sansSemiBold: path.join(root, "source-sans-3", "600SemiBold", "SourceSans3_600SemiBold.ttf"),
  sansBold: path.join(root, "source-sans-3", "700Bold", "SourceSans3_700Bold.ttf"),
  monoRegular: path.join(root, "source-code-pro", "400Regular", "SourceCodePro_400Regular.ttf"),
  monoSemiBold: path.join(root, "source-code-pro", "600SemiBold", "SourceCodePro_600SemiBold.ttf"),
} as const;
