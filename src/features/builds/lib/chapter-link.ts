import { chapterLink as sharedChapterLink } from '../../../shared/chapters';
import { videoLinkPattern } from '../../../shared/schemas/builds';

/** An example hosted-video address for the preview; invented, on a reserved example domain. */
export const EXAMPLE_VIDEO_URL = 'https://video.example/watch?v=k7Rq2bHatch';

/** The preview of a chapter link: the shared rule, or null while the pattern or address is invalid. */
export function chapterLink(videoUrl: string, pattern: string, seconds: number): string | null {
  if (!videoLinkPattern.safeParse(pattern).success || !Number.isInteger(seconds) || seconds < 0) return null;
  try {
    return sharedChapterLink(videoUrl, seconds, pattern);
  } catch {
    return null;
  }
}
