package org.loopledger.notebook;

import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * Reads a notebook in either of its file forms, chosen by the file name: {@code .ipynb} (nbformat 4 JSON,
 * {@link NotebookJson}) or {@code .java} (the plain-text form, {@link PlainTextNotebook}).
 */
public final class NotebookFile {
    private NotebookFile() {}

    /** True for a file name in the plain-text form ({@code .java}). */
    public static boolean isPlainText(Path file) {
        return file.getFileName().toString().endsWith(PlainTextNotebook.SUFFIX);
    }

    /** Reads either form; every defect is an IllegalArgumentException naming the file and the fix. */
    public static Notebook read(Path file) {
        if (!isPlainText(file)) return NotebookJson.read(file);
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder().decode(java.nio.ByteBuffer.wrap(Files.readAllBytes(file))).toString();
        } catch (NoSuchFileException e) {
            throw new IllegalArgumentException("notebook " + file + " does not exist; check the path");
        } catch (CharacterCodingException e) {
            throw new IllegalArgumentException(file + " is not UTF-8 text; save it as UTF-8 and try again");
        } catch (IOException e) {
            throw new IllegalArgumentException("cannot read notebook " + file + ": " + e.getMessage());
        }
        return PlainTextNotebook.parse(text, file.toString());
    }
}
