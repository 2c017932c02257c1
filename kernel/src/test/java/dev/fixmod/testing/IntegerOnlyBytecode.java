package dev.fixmod.testing;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.net.URISyntaxException;
import java.net.URL;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Proves from the compiled bytecode that per-sample methods use integer arithmetic only, as an FPGA or MCU datapath
 * would. It disassembles class files with the JDK's own {@code javap -c -p -s} (found under {@code java.home}) and
 * fails if a named method, or any kernel method it calls, contains a floating-point instruction.
 *
 * <p>What counts as floating point:
 * <ul>
 *   <li>every {@code d*} and {@code f*} opcode ({@code dadd}, {@code dmul}, {@code dcmpl}, {@code dload},
 *       {@code dstore}, {@code dconst_0}, {@code d2i}, {@code faload}, {@code fconst_1}, ...), but not the stack
 *       opcodes {@code dup*};</li>
 *   <li>conversions into floating point: {@code i2d}, {@code i2f}, {@code l2d}, {@code l2f};</li>
 *   <li>{@code ldc}/{@code ldc_w}/{@code ldc2_w} of a {@code float} or {@code double} constant;</li>
 *   <li>{@code newarray} of {@code float} or {@code double};</li>
 *   <li>a field access whose type is {@code float} or {@code double} (arrays of them are references: loading an
 *       element is a {@code daload}, caught above);</li>
 *   <li>a call of any method taking or returning {@code float} or {@code double}, e.g. {@code java/lang/Math.sqrt}
 *       or {@code StrictMath.floor}.</li>
 * </ul>
 *
 * <p>Calls are followed: a call into a class of a {@code dev.fixmod} package (including the class itself and its
 * {@code dev.fixmod} superclasses) is checked transitively, so a helper that hides a {@code double} is found. Calls
 * into the JDK are not followed; they are accepted when their signature has no {@code float} or {@code double}.
 * Abstract and interface methods have no code; their implementations must be named explicitly.
 *
 * <p>Usage: {@code IntegerOnlyBytecode.assertIntegerOnly(FixedMapper.class, "mapLabels", "mapBits")}. Every overload
 * of a named method is checked; a name the class does not declare fails, so a rename cannot silently empty the check.
 * Construction code is free to use doubles: only name per-sample methods.
 */
public final class IntegerOnlyBytecode {

    private static final String KERNEL_PREFIX = "dev/fixmod/";

    private static final Set<String> TO_FLOATING = Set.of("i2d", "i2f", "l2d", "l2f");
    private static final Pattern MEMBER = Pattern.compile("^  (\\S.*\\));$|^  (\\S.*\\)) throws .*;$|^  (static \\{\\});$");
    private static final Pattern INSTRUCTION = Pattern.compile("^\\s+\\d+: ([a-z][a-z0-9_]*)\\b(.*)$");
    private static final Pattern INVOKED = Pattern.compile(
            "//\\s+(?:Method|InterfaceMethod)\\s+(?:([\\w/$]+)\\.)?(\"<init>\"|\"<clinit>\"|[\\w$]+):(\\S+)");
    private static final Pattern FIELD = Pattern.compile("//\\s+Field\\s+(?:[\\w/$]+\\.)?[\\w$]+:(\\S+)");
    private static final Pattern CLASS_HEADER = Pattern.compile(
            "^(?:[a-z]+ )*(?:class|interface|enum) ([\\w.$]+)(?:<.*?>)?(?: extends ([\\w.$]+))?.*\\{$");

    private static final Map<String, Disassembly> CACHE = new ConcurrentHashMap<>();

    private IntegerOnlyBytecode() {
    }

    /**
     * Fails with an {@link AssertionError} listing every floating-point instruction reached from the named methods of
     * {@code type}, with the call chain that reaches it.
     *
     * @param type        a compiled class (from {@code target/classes} or {@code target/test-classes})
     * @param methodNames the per-sample methods; every overload of each name is checked
     */
    public static void assertIntegerOnly(Class<?> type, String... methodNames) {
        List<String> violations = floatingPointUses(type, methodNames);
        if (!violations.isEmpty()) {
            throw new AssertionError("floating point in the integer-only path of " + type.getName() + ":\n  "
                    + String.join("\n  ", violations));
        }
    }

    /**
     * The floating-point instructions reached from the named methods, one line each ({@code method <- caller: offset:
     * instruction}); empty if the methods are integer-only. Fails if {@code methodNames} is empty or names a method
     * that {@code type} does not declare.
     */
    public static List<String> floatingPointUses(Class<?> type, String... methodNames) {
        if (methodNames.length == 0) {
            throw new AssertionError("name at least one method of " + type.getName() + " to check");
        }
        String internalName = type.getName().replace('.', '/');
        Disassembly own = disassembly(internalName);
        Deque<Frame> work = new ArrayDeque<>();
        for (String name : methodNames) {
            List<Method> overloads = own.byName(name);
            if (overloads.isEmpty()) {
                throw new AssertionError(type.getName() + " declares no method named '" + name + "'; declared: "
                        + own.methods.keySet());
            }
            for (Method m : overloads) {
                if (m.code.isEmpty()) {
                    throw new AssertionError(type.getName() + "." + name + m.descriptor + " has no code (abstract or"
                            + " native); name the implementing classes' methods instead");
                }
                work.add(new Frame(internalName, m, name + m.descriptor));
            }
        }
        List<String> violations = new ArrayList<>();
        Set<String> visited = new HashSet<>();
        while (!work.isEmpty()) {
            Frame frame = work.removeFirst();
            if (!visited.add(frame.owner + "." + frame.method.name + frame.method.descriptor)) {
                continue;
            }
            for (String line : frame.method.code) {
                Matcher ins = INSTRUCTION.matcher(line);
                if (!ins.matches()) {
                    continue;
                }
                String opcode = ins.group(1);
                String rest = ins.group(2);
                if (isFloatingPoint(opcode, rest)) {
                    violations.add(frame.chain + ": " + line.trim());
                    continue;
                }
                if (opcode.startsWith("invoke") && !opcode.equals("invokedynamic")) {
                    Matcher call = INVOKED.matcher(rest);
                    if (call.find()) {
                        String owner = call.group(1) == null ? frame.owner : call.group(1);
                        String name = call.group(2).replace("\"", "");
                        String descriptor = call.group(3);
                        if (owner.startsWith(KERNEL_PREFIX)) {
                            Resolved target = resolve(owner, name, descriptor);
                            if (target != null) {
                                work.add(new Frame(target.owner, target.method,
                                        frame.chain + " -> " + simpleName(target.owner) + "." + name));
                            }
                        }
                    }
                }
            }
        }
        return violations;
    }

    private static boolean isFloatingPoint(String opcode, String rest) {
        char first = opcode.charAt(0);
        if ((first == 'd' && !opcode.startsWith("dup")) || first == 'f') {
            return true;
        }
        if (TO_FLOATING.contains(opcode)) {
            return true;
        }
        if (opcode.startsWith("ldc")) {
            return rest.contains("// double") || rest.contains("// float");
        }
        if (opcode.equals("newarray")) {
            return rest.contains("double") || rest.contains("float");
        }
        if (opcode.startsWith("get") || opcode.startsWith("put")) {
            Matcher field = FIELD.matcher(rest);
            return field.find() && (field.group(1).equals("D") || field.group(1).equals("F"));
        }
        if (opcode.startsWith("invoke")) {
            Matcher call = INVOKED.matcher(rest);
            return call.find() && signatureHasFloatingPoint(call.group(3));
        }
        return false;
    }

    /** Whether a method descriptor has a primitive {@code float} or {@code double} parameter or result. */
    static boolean signatureHasFloatingPoint(String descriptor) {
        boolean inArray = false;
        for (int p = 0; p < descriptor.length(); p++) {
            char c = descriptor.charAt(p);
            if (c == 'L') {
                p = descriptor.indexOf(';', p);
                inArray = false;
            } else if (c == '[') {
                inArray = true;
            } else if (c == 'D' || c == 'F') {
                if (!inArray) {
                    return true;
                }
                inArray = false;
            } else {
                inArray = false;
            }
        }
        return false;
    }

    /** The method itself or, if the class inherits it, from the nearest kernel superclass declaring it. */
    private static Resolved resolve(String owner, String name, String descriptor) {
        String current = owner;
        while (current != null && current.startsWith(KERNEL_PREFIX)) {
            Disassembly d = disassembly(current);
            Method m = d.methods.get(name + descriptor);
            if (m != null) {
                return m.code.isEmpty() ? null : new Resolved(current, m);
            }
            current = d.superclass;
        }
        return null; // inherited from the JDK (e.g. Enum.ordinal): its signature was already checked
    }

    private static String simpleName(String internalName) {
        return internalName.substring(internalName.lastIndexOf('/') + 1);
    }

    private static Disassembly disassembly(String internalName) {
        Disassembly cached = CACHE.get(internalName);
        if (cached != null) {
            return cached;
        }
        synchronized (CACHE) {
            if (!CACHE.containsKey(internalName)) {
                CACHE.putAll(disassembleAround(internalName));
            }
        }
        Disassembly d = CACHE.get(internalName);
        if (d == null) {
            throw new AssertionError("javap printed no class " + internalName);
        }
        return d;
    }

    /**
     * Disassembles the class and, in the same javap run (starting a JVM costs far more than disassembling), every
     * other kernel class under the same class path root, since calls are followed into them.
     */
    private static Map<String, Disassembly> disassembleAround(String internalName) {
        URL url = IntegerOnlyBytecode.class.getClassLoader().getResource(internalName + ".class");
        if (url == null) {
            throw new AssertionError("no class file for " + internalName + " on the test class path");
        }
        List<String> targets = new ArrayList<>();
        if ("file".equals(url.getProtocol())) {
            Path file;
            try {
                file = Path.of(url.toURI());
            } catch (URISyntaxException e) {
                throw new AssertionError("bad class file location " + url, e);
            }
            Path root = file.getRoot().resolve(file.subpath(0, file.getNameCount() - internalName.split("/").length));
            try (var files = Files.walk(root.resolve(KERNEL_PREFIX))) {
                files.filter(f -> f.toString().endsWith(".class"))
                        .filter(f -> !CACHE.containsKey(root.relativize(f).toString().replace('\\', '/')
                                .replaceAll("\\.class$", "")))
                        .map(Path::toString).sorted().forEach(targets::add);
            } catch (IOException e) {
                throw new AssertionError("could not list the classes under " + root, e);
            }
        } else {
            targets.add(url.toString());
        }
        return parse(javap(targets));
    }

    private static String javap(List<String> targets) {
        Path javap = Path.of(System.getProperty("java.home"), "bin", "javap");
        if (!Files.isExecutable(javap)) {
            throw new AssertionError("javap not found at " + javap + "; a full JDK is needed to inspect bytecode");
        }
        List<String> command = new ArrayList<>(List.of(javap.toString(), "-c", "-p", "-s"));
        command.addAll(targets);
        try {
            Process process = new ProcessBuilder(command).redirectErrorStream(true).start();
            String output = readAll(process.getInputStream());
            if (!process.waitFor(120, TimeUnit.SECONDS) || process.exitValue() != 0) {
                throw new AssertionError("javap failed on " + targets + ":\n" + output);
            }
            return output;
        } catch (IOException e) {
            throw new AssertionError("could not run " + javap, e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new AssertionError("interrupted while running javap", e);
        }
    }

    private static String readAll(InputStream in) throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        in.transferTo(bytes);
        return bytes.toString(StandardCharsets.UTF_8);
    }

    /** Splits javap's output of one or more classes at each class header. */
    private static Map<String, Disassembly> parse(String output) {
        Map<String, Disassembly> classes = new LinkedHashMap<>();
        String className = null;
        String superclass = null;
        Map<String, Method> methods = null;
        Method current = null;
        boolean awaitingDescriptor = false;
        String pendingName = null;
        for (String line : output.split("\\R")) {
            Matcher header = CLASS_HEADER.matcher(line);
            if (header.matches()) {
                if (className != null) {
                    classes.put(className, new Disassembly(superclass, methods));
                }
                className = header.group(1).replace('.', '/');
                superclass = header.group(2) == null ? null : header.group(2).replace('.', '/');
                methods = new LinkedHashMap<>();
                current = null;
                awaitingDescriptor = false;
                continue;
            }
            if (methods == null) {
                continue;
            }
            Matcher member = MEMBER.matcher(line);
            if (member.matches()) {
                String signature = member.group(1) != null ? member.group(1)
                        : member.group(2) != null ? member.group(2) : member.group(3);
                pendingName = memberName(signature);
                awaitingDescriptor = true;
                current = null;
                continue;
            }
            if (awaitingDescriptor && line.trim().startsWith("descriptor: ")) {
                String descriptor = line.trim().substring("descriptor: ".length());
                current = new Method(pendingName, descriptor, new ArrayList<>());
                methods.put(pendingName + descriptor, current);
                awaitingDescriptor = false;
                continue;
            }
            if (current != null && INSTRUCTION.matcher(line).matches()) {
                current.code.add(line);
            }
        }
        if (className != null) {
            classes.put(className, new Disassembly(superclass, methods));
        }
        return classes;
    }

    private static String memberName(String signature) {
        if (signature.startsWith("static {")) {
            return "<clinit>";
        }
        String beforeParameters = signature.substring(0, signature.indexOf('('));
        String name = beforeParameters.substring(beforeParameters.lastIndexOf(' ') + 1);
        return name.contains(".") ? "<init>" : name;
    }

    private record Method(String name, String descriptor, List<String> code) {
    }

    private record Resolved(String owner, Method method) {
    }

    private record Frame(String owner, Method method, String chain) {
    }

    private record Disassembly(String superclass, Map<String, Method> methods) {
        List<Method> byName(String name) {
            List<Method> found = new ArrayList<>();
            for (Method m : methods.values()) {
                if (m.name.equals(name)) {
                    found.add(m);
                }
            }
            return found;
        }
    }
}
