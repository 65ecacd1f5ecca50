import { useMutation } from '@tanstack/react-query';
import { ApiError, errorFromResponse } from '@client/lib/api';

/** The file name a Content-Disposition header gives (RFC 6266: filename* first, then filename). */
export function fileNameFromDisposition(header: string | null, fallback: string): string {
  if (!header) return fallback;
  const star = /filename\*\s*=\s*UTF-8''([^;]+)/i.exec(header);
  if (star) {
    try {
      return decodeURIComponent(star[1].trim());
    } catch {
      /* fall through to the plain form */
    }
  }
  const plain = /filename\s*=\s*"([^"]*)"/i.exec(header) ?? /filename\s*=\s*([^;]+)/i.exec(header);
  return plain ? plain[1].trim() : fallback;
}

/**
 * Fetches a file from the API with the session cookie and hands it to the
 * browser as a download; failures become ApiError with the server's message
 * (so a refused download is explained on the page, not saved as a file).
 */
export async function downloadFile(url: string, fallbackName: string): Promise<string> {
  let response: Response;
  try {
    response = await fetch(url, { credentials: 'same-origin' });
  } catch {
    throw new ApiError(0, 'network_error', 'Bondmark could not be reached. Check the connection and try again.');
  }
  if (!response.ok) throw await errorFromResponse(response);
  const name = fileNameFromDisposition(response.headers.get('content-disposition'), fallbackName);
  const blob = await response.blob();
  const href = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = href;
  link.download = name;
  link.style.display = 'none';
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(href), 60_000);
  return name;
}

export function useDownloadTemplate() {
  return useMutation({
    mutationFn: (args: { url: string; fallbackName: string }) => downloadFile(args.url, args.fallbackName),
  });
}
