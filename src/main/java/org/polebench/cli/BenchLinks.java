package org.polebench.cli;

import java.io.IOException;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Function;
import org.polebench.InputProblem;
import org.polebench.capture.LineTransport;
import org.polebench.profile.PortSettings;
import org.polebench.capture.SerialLine;
import org.polebench.capture.TcpLine;

/**
 * The links named on a command line, opened: {@code --port [NAME=]PATH} and
 * {@code --tcp [NAME=]HOST:PORT}, where NAME is one of the profile's instruments and a value
 * without a name serves every instrument not named. Two instruments on one port share one
 * open link.
 */
final class BenchLinks implements AutoCloseable {
    private final Map<String, LineTransport> links;

    private BenchLinks(Map<String, LineTransport> links) {
        this.links = links;
    }

    Map<String, LineTransport> byName() {
        return links;
    }

    /** @return true when every link ends on this machine (pseudo-terminals, loopback) */
    boolean allLocal() {
        return links.values().stream().allMatch(LineTransport::local);
    }

    /**
     * @param names    the profile's link names
     * @param settings each name's port settings
     * @throws InputProblem when the options leave a name without a link, name an unknown
     *                      instrument, or put instruments with different settings on one port
     * @throws IOException  when a port does not open or nothing answers at an address
     */
    static BenchLinks open(List<String> ports, List<String> tcps, List<String> names,
                           Function<String, PortSettings> settings, int connectTimeoutMs) throws InputProblem, IOException {
        Map<String, String> where = new LinkedHashMap<>();
        String anyPort = assign(ports, "--port", names, where);
        String anyTcp = assign(tcps, "--tcp", names, where);
        if (anyPort != null && anyTcp != null) {
            throw new InputProblem(null, 0, "both --port and --tcp are given without an instrument name",
                    "give one, or name the instruments: --port generator=/dev/ttyUSB0 --tcp meter=10.0.0.5:5025");
        }
        String fallback = anyPort != null ? anyPort : anyTcp;
        for (String name : names) {
            if (!where.containsKey(name)) {
                if (fallback == null) {
                    throw new InputProblem(null, 0, "no port for the instrument '" + name + "'",
                            "give --port PATH (or --tcp HOST:PORT), or --port " + name + "=PATH");
                }
                where.put(name, fallback);
            }
        }
        Map<String, LineTransport> open = new LinkedHashMap<>();
        Map<String, LineTransport> byAddress = new LinkedHashMap<>();
        Map<String, PortSettings> settingsByAddress = new LinkedHashMap<>();
        try {
            for (String name : names) {
                String address = where.get(name);
                PortSettings wanted = settings.apply(name);
                PortSettings before = settingsByAddress.putIfAbsent(address, wanted);
                if (before != null && !before.equals(wanted)) {
                    throw new InputProblem(null, 0, "two instruments with different port settings share " + address.substring(4),
                            "put them on ports of their own, or make their settings in the profile agree");
                }
                LineTransport link = byAddress.get(address);
                if (link == null) {
                    link = address.startsWith("tcp:") ? connect(address.substring(4), wanted, connectTimeoutMs)
                            : SerialLine.open(address.substring(4), wanted);
                    byAddress.put(address, link);
                }
                open.put(name, link);
            }
        } catch (InputProblem | IOException | RuntimeException e) {
            byAddress.values().forEach(LineTransport::close);
            throw e;
        }
        return new BenchLinks(open);
    }

    /** @return the value given without a name, or null; named values go into where, as "dev:" or "tcp:" addresses */
    private static String assign(List<String> values, String option, List<String> names, Map<String, String> where)
            throws InputProblem {
        String unnamed = null;
        String kind = option.equals("--tcp") ? "tcp:" : "dev:";
        for (String value : values) {
            int eq = value.indexOf('=');
            String name = eq > 0 ? value.substring(0, eq) : null;
            if (name != null && names.contains(name)) {
                if (where.put(name, kind + value.substring(eq + 1)) != null) {
                    throw new InputProblem(null, 0, "the instrument '" + name + "' is given two ports",
                            "give each instrument one " + option);
                }
            } else if (name != null && !value.contains("/") && !value.contains("\\")) {
                throw new InputProblem(null, 0, option + " " + value + " names '" + name
                        + "', which is not an instrument of the profile", "use one of: " + String.join(", ", names));
            } else {
                if (unnamed != null) {
                    throw new InputProblem(null, 0, "two " + option + " values without an instrument name",
                            "name them: " + option + " " + names.get(0) + "=…");
                }
                unnamed = kind + value;
            }
        }
        return unnamed;
    }

    private static LineTransport connect(String hostPort, PortSettings settings, int timeoutMs)
            throws InputProblem, IOException {
        int colon = hostPort.lastIndexOf(':');
        if (colon <= 0 || colon == hostPort.length() - 1) {
            throw new InputProblem(null, 0, "--tcp " + hostPort + " is not HOST:PORT", "write it as 192.168.0.20:5025");
        }
        int port;
        try {
            port = Integer.parseInt(hostPort.substring(colon + 1));
        } catch (NumberFormatException e) {
            port = -1;
        }
        if (port < 1 || port > 65535) {
            throw new InputProblem(null, 0, "--tcp " + hostPort + " has no port number 1 to 65535",
                    "write it as 192.168.0.20:5025");
        }
        return TcpLine.connect(hostPort.substring(0, colon), port, settings.lineEnding(), timeoutMs);
    }

    /** @return each open link once, with the names it serves */
    List<String> describe() {
        Map<LineTransport, List<String>> served = new IdentityHashMap<>();
        List<LineTransport> order = new ArrayList<>();
        links.forEach((name, link) -> {
            if (!served.containsKey(link)) {
                order.add(link);
            }
            served.computeIfAbsent(link, l -> new ArrayList<>()).add(name);
        });
        List<String> lines = new ArrayList<>();
        for (LineTransport link : order) {
            lines.add(String.join(" and ", served.get(link)) + " on " + link.describe());
        }
        return lines;
    }

    @Override
    public void close() {
        links.values().forEach(LineTransport::close);
    }
}
