package dev.plumb.lang;

import java.util.List;

/** A parsed file: its source and its statements in order. */
public record Program(SourceFile source, List<Stmt> statements) {
    public Program {
        statements = List.copyOf(statements);
    }

    public <T extends Stmt> List<T> all(Class<T> kind) {
        return statements.stream().filter(kind::isInstance).map(kind::cast).toList();
    }
}
