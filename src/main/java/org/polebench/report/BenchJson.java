package org.polebench.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.Locale;
import org.polebench.bench.BenchEffect;
import org.polebench.units.Decibels;

/**
 * The {@code bench} object of {@code predict --bench --json}: the bench as declared, the board's
 * own midband gain and lower corner, the ones this bench will show, each element's alone, and
 * the warnings of {@link BenchText}. Keys are snake_case and carry their unit.
 */
public final class BenchJson {
    private final JsonNodeFactory nodes = JsonNodeFactory.instance;

    public ObjectNode of(BenchEffect effect) {
        ObjectNode root = nodes.objectNode();
        effect.bench().source().ifPresent(f -> root.put("file", f.toString()));
        root.put("description", effect.bench().describe());
        root.set("board_alone", response(effect.own()));
        root.set("as_measured", response(effect.measured()));
        ArrayNode elements = root.putArray("elements");
        for (BenchEffect.ElementEffect element : effect.elements()) {
            ObjectNode row = elements.addObject();
            row.put("element", element.element().name().toLowerCase(Locale.ROOT).replace('_', '-'));
            row.setAll(response(element.measured()));
        }
        ArrayNode warnings = root.putArray("warnings");
        new BenchText().warnings(effect).forEach(warnings::add);
        return root;
    }

    private ObjectNode response(BenchEffect.Response response) {
        ObjectNode node = nodes.objectNode();
        node.put("midband_gain_db", Decibels.fromRatio(response.midbandGain()));
        node.put("midband_gain_ratio", response.midbandGain());
        if (response.lowerCornerHz().isPresent()) {
            node.put("lower_corner_hz", response.lowerCornerHz().getAsDouble());
        } else {
            node.putNull("lower_corner_hz");
        }
        return node;
    }
}
