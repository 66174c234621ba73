package dev.touchstone.harness;

import dev.touchstone.core.param.ParameterException;

import java.io.UncheckedIOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;

/**
 * Bad input: a file or value the user gave that cannot be used. The message is one line
 * naming the file and place (file, line, field, option) and what is wrong; the command line
 * prints it as {@code error: …} with exit status 2. It lives at the bottom of the harness so
 * that file formats, studies and the command line can all raise it without depending on
 * one another. {@link #from} is the one place that decides what else counts as bad input.
 */
public class BadInputException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public BadInputException(String message) {
        super(oneLine(message));
    }

    public BadInputException(String message, Throwable cause) {
        super(oneLine(message), cause);
    }

    /**
     * The message as lines, one per problem: just the message, unless the input had several
     * independent problems found at once (a study file). A wrapper restating its cause's
     * message gives the cause's lines.
     */
    public java.util.List<String> lines() {
        if (getCause() instanceof BadInputException b && java.util.Objects.equals(b.getMessage(), getMessage())) {
            return b.lines();
        }
        return java.util.List.of(getMessage());
    }

    /**
     * The bad input behind {@code failure}, or null when it is not bad input (a fault of the
     * tool): a {@code BadInputException} anywhere in the cause chain, a parameter value refused
     * by its declaration ({@link ParameterException}: core's own bad-input type, since core
     * cannot see this one and plug-ins raise it too), or a file-system refusal that names the
     * file (no such file, permission denied, exists already, not a folder).
     */
    public static BadInputException from(Throwable failure) {
        for (Throwable t = failure; t != null; t = t.getCause()) {
            if (t instanceof BadInputException b) {
                return b;
            }
            if (t instanceof ParameterException p) {
                return new BadInputException(p.getMessage(), failure);
            }
            Throwable io = t instanceof UncheckedIOException u ? u.getCause() : t;
            if (io instanceof FileSystemException f && f.getFile() != null) {
                return new BadInputException(f.getFile() + ": " + reason(f), failure);
            }
            if (t.getCause() == t) {
                break;
            }
        }
        return null;
    }

    private static String reason(FileSystemException f) {
        if (f instanceof NoSuchFileException) {
            return "no such file or folder (check the path)";
        }
        if (f instanceof AccessDeniedException) {
            return "permission denied (check its permissions)";
        }
        if (f instanceof FileAlreadyExistsException) {
            return "exists already (remove it or choose another name)";
        }
        if (f instanceof NotDirectoryException) {
            return "is not a folder";
        }
        return f.getReason() == null ? "cannot be used" : f.getReason();
    }

    /**
     * A message as one line: parser messages that span several lines (a YAML parser's
     * context, the echoed source line and its caret) are cut to their meaningful lines,
     * joined with "; ".
     */
    public static String oneLine(String message) {
        message = parserEventsInWords(message);
        if (message == null || message.indexOf('\n') < 0 && message.indexOf('\r') < 0) {
            return message;
        }
        StringBuilder sb = new StringBuilder();
        for (String line : message.split("\r?\n|\r")) {
            String t = line.strip();
            if (t.isEmpty() || t.startsWith("^") || line.startsWith(" ") || line.startsWith("\t")
                    || t.startsWith("in 'reader'") || t.startsWith("at [Source")) {
                continue;
            }
            sb.append(sb.length() == 0 ? "" : "; ").append(t);
        }
        return sb.length() == 0 ? message.strip().replaceAll("\\s*\\R\\s*", "; ") : sb.toString();
    }

    private static final java.util.regex.Pattern PARSER_EVENT = java.util.regex.Pattern.compile(
            "<(?:[a-z][a-z0-9_]*\\.)+([A-Z][A-Za-z]*?)Event\\([^>]*\\)>");

    /**
     * The YAML parser names what it found by its event class
     * ({@code <org.yaml.snakeyaml.events.MappingStartEvent(anchor=null, …)>}); a user needs the
     * thing in the file instead.
     */
    private static String parserEventsInWords(String message) {
        if (message == null || message.indexOf('<') < 0) {
            return message;
        }
        java.util.regex.Matcher m = PARSER_EVENT.matcher(message);
        StringBuilder sb = new StringBuilder();
        while (m.find()) {
            String word = switch (m.group(1)) {
                case "MappingStart" -> "the start of a map ({ or key: value)";
                case "MappingEnd" -> "the end of a map";
                case "SequenceStart" -> "the start of a list ([ or - item)";
                case "SequenceEnd" -> "the end of a list";
                case "Scalar" -> "a value";
                case "Alias" -> "an alias (*name)";
                case "DocumentStart" -> "the start of a document (---)";
                case "DocumentEnd" -> "the end of a document";
                default -> "something else";
            };
            m.appendReplacement(sb, java.util.regex.Matcher.quoteReplacement(word));
        }
        m.appendTail(sb);
        return sb.toString().replace("(Scalar value in YAML)", "");
    }
}
