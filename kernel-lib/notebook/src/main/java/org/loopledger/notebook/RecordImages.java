package org.loopledger.notebook;

import org.loopledger.display.ImageData;
import org.loopledger.display.MarkdownHtml;

import java.io.IOException;
import java.net.URLDecoder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.Map;
import java.util.Optional;

/**
 * Where the tuning record finds the pictures that Markdown refers to, always as {@code data:} URIs so that
 * the record fetches nothing when opened: {@code attachment:NAME} from the cell's own attachments, and
 * relative paths to image files inside the notebook's folder (not above it, not through a link leading out
 * of it, at most {@value #MAX_FILE_BYTES} bytes). The image type is read from the bytes. Anything else
 * (remote URLs, files that are not images, missing files) is left to {@link MarkdownHtml} to show as link text.
 */
final class RecordImages implements MarkdownHtml.Images {
    /** Largest local image file embedded (16 MiB): a record stays a document, not an archive. */
    static final long MAX_FILE_BYTES = 16L << 20;

    private final Map<String, Map<String, String>> attachments;
    private final Path folder;

    /** @param folder the notebook's folder, or null where relative paths must not be read */
    RecordImages(Map<String, Map<String, String>> attachments, Path folder) {
        this.attachments = attachments;
        this.folder = folder;
    }

    @Override
    public Optional<String> dataUri(String destination) {
        String d = destination.strip();
        if (d.regionMatches(true, 0, "attachment:", 0, 11)) {
            String name = d.substring(11);
            Map<String, String> bundle = attachments.containsKey(name) ? attachments.get(name) : attachments.get(decode(name));
            if (bundle == null) return Optional.empty();
            for (String mime : ImageData.EMBEDDABLE) {
                Optional<String> uri = ImageData.fromBundle(mime, bundle.get(mime));
                if (uri.isPresent()) return uri;
            }
            return Optional.empty();
        }
        if (folder == null || !MarkdownHtml.isRelative(d)) return Optional.empty();
        return file(d);
    }

    private Optional<String> file(String reference) {
        String path = reference;
        int cut = indexOfAny(path, '?', '#');
        if (cut >= 0) path = path.substring(0, cut);
        path = decode(path);
        if (path.isEmpty() || path.indexOf('\0') >= 0) return Optional.empty();
        try {
            Path base = folder.toAbsolutePath().normalize();
            Path p = base.resolve(path).normalize();
            if (!p.startsWith(base) || !Files.isRegularFile(p)) return Optional.empty();
            Path real = p.toRealPath();
            if (!real.startsWith(base.toRealPath()) || Files.size(real) > MAX_FILE_BYTES) return Optional.empty();
            return ImageData.dataUri(Files.readAllBytes(real));
        } catch (IOException | InvalidPathException | SecurityException e) {
            return Optional.empty();
        }
    }

    private static int indexOfAny(String s, char a, char b) {
        int i = s.indexOf(a), j = s.indexOf(b);
        return i < 0 ? j : j < 0 ? i : Math.min(i, j);
    }

    /** Percent-decoding of a URL path ("+" stays a plus); the text unchanged where it is not valid. */
    private static String decode(String s) {
        try {
            return URLDecoder.decode(s.replace("+", "%2B"), StandardCharsets.UTF_8);
        } catch (IllegalArgumentException e) {
            return s;
        }
    }
}
