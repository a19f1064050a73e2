package org.polebench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.reflect.Method;
import java.lang.reflect.Modifier;
import java.lang.reflect.Proxy;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.function.BiFunction;

/**
 * Checks a sealed type against its {@code Cases} interface, the visitor through which code
 * tells the permitted types apart (issue 12): one case method per permitted type, taking that
 * type, and every permitted type's {@code match} calling its own case. The compiler already
 * refuses an implementation of {@code Cases} that misses a method; this catches the two
 * mistakes it lets through, a permitted type with no case of its own and a {@code match} that
 * calls another type's case (the visitor's double dispatch, Gamma, Helm, Johnson and
 * Vlissides, Design Patterns, 1994, "Visitor", from memory).
 */
public final class SealedCases {
    private SealedCases() {
    }

    /**
     * @param sealed  the sealed interface
     * @param cases   its {@code Cases} interface
     * @param samples one or more instances; together they must cover every permitted type
     * @param match   calls {@code sample.match(cases)} and returns what it gives
     */
    public static <T> void assertEveryTypeHasItsOwnCase(Class<T> sealed, Class<?> cases, List<? extends T> samples,
                                                        BiFunction<T, Object, Object> match) {
        assertTrue(sealed.isSealed(), sealed.getSimpleName() + " should be sealed");
        Set<Class<?>> permitted = new HashSet<>(Arrays.asList(sealed.getPermittedSubclasses()));

        List<Class<?>> caseTypes = new ArrayList<>();
        for (Method method : cases.getDeclaredMethods()) {
            if (Modifier.isAbstract(method.getModifiers())) {
                assertEquals(1, method.getParameterCount(), cases.getName() + "." + method.getName());
                caseTypes.add(method.getParameterTypes()[0]);
            }
        }
        assertEquals(permitted.size(), caseTypes.size(), "one case per permitted type of " + sealed.getSimpleName());
        assertEquals(permitted, new HashSet<>(caseTypes), "the case methods of " + cases.getName());

        Set<Class<?>> sampled = new HashSet<>();
        for (T sample : samples) {
            sampled.add(sample.getClass());
        }
        assertEquals(permitted, sampled, "samples of every permitted type of " + sealed.getSimpleName());

        // a proxy whose every case answers with the case method called
        Object recorder = Proxy.newProxyInstance(cases.getClassLoader(), new Class<?>[] {cases},
                (proxy, method, args) -> method);
        for (T sample : samples) {
            Method called = (Method) match.apply(sample, recorder);
            assertEquals(sample.getClass(), called.getParameterTypes()[0],
                    sample.getClass().getSimpleName() + ".match calls " + called.getName());
        }
    }
}
