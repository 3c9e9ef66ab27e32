package org.evanesce.io.output;

import java.io.IOException;

/**
 * evanesce will not write (or replace) an output folder there: the path is the case file's folder or
 * above it, a file, a symbolic link, a folder holding files evanesce did not write, or a name the
 * file system cannot hold. The message names the path and the reason; the commands exit with code 2
 * (bad input) and nothing has been written or deleted.
 */
public final class OutputRefusedException extends IOException {

    private static final long serialVersionUID = 1L;

    public OutputRefusedException(String message) {
        super(message);
    }
}
