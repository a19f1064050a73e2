package org.polebench.ledger;

import java.io.IOException;
import java.nio.file.Path;
import org.polebench.reconcile.ReconcileResult;
import org.polebench.sweepfile.ImportedSweep;

/**
 * Writes one board's reconcile result document (the JSON a report's {@code result.json} holds),
 * which the ledger keeps beside the key figures. The front end supplies it, since the document's
 * writer sits in a package after the ledger's.
 */
@FunctionalInterface
public interface ResultDocument {
    /**
     * @param boardId the board's identity as the ledger records it
     * @return the document's text
     * @throws IOException when a file the document digests cannot be read
     */
    String of(ReconcileResult result, Path stageFile, Path sweepFile, ImportedSweep imported, String boardId)
            throws IOException;
}
