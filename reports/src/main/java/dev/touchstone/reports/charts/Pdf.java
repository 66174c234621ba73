package dev.touchstone.reports.charts;

import com.lowagie.text.Document;
import com.lowagie.text.Rectangle;
import com.lowagie.text.pdf.PdfContentByte;
import com.lowagie.text.pdf.PdfWriter;

import java.awt.Graphics2D;
import java.io.ByteArrayOutputStream;

/**
 * Renders a {@link Figure} to a standalone one-page PDF with OpenPDF's Java2D bridge
 * ({@code PdfGraphics2D}). The page is exactly the figure's size, one point per pixel, with
 * no margins. Text is drawn as outlines ({@code createGraphicsShapes}) so the file embeds no
 * fonts and looks the same on every reader; lines, fills, clips and transparency stay vector.
 */
public final class Pdf {

    private Pdf() {
    }

    /** The figure as the bytes of a PDF document. */
    public static byte[] of(Figure figure) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        Document document = new Document(new Rectangle(figure.width(), figure.height()), 0, 0, 0, 0);
        PdfWriter writer = PdfWriter.getInstance(document, out);
        document.open();
        PdfContentByte content = writer.getDirectContent();
        Graphics2D g = content.createGraphicsShapes(figure.width(), figure.height());
        try {
            figure.draw(g);
        } finally {
            g.dispose();
        }
        document.close();
        return out.toByteArray();
    }
}
