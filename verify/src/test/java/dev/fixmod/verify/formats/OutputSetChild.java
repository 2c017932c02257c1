package dev.fixmod.verify.formats;

import java.io.OutputStream;
import java.nio.file.Path;

/** Run in a child JVM by OutputSetTest: starts a set, writes part of a file, reports its work folder, then waits. */
public final class OutputSetChild {

    private OutputSetChild() {
    }

    public static void main(String[] args) throws Exception {
        OutputSet set = OutputSet.create(Path.of(args[0]), false);
        OutputStream out = set.newFile("part/data.hex");
        out.write("00ff\n".getBytes(java.nio.charset.StandardCharsets.US_ASCII));
        out.flush();
        System.out.println(set.workFolder());
        System.out.flush();
        Thread.sleep(120_000);
    }
}
