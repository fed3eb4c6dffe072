package org.skyrota.web.system;

import java.util.List;
import java.util.function.Function;

import org.springframework.data.domain.Page;

/** One page of a listing, in a shape of our own rather than Spring Data's internal one. */
public record PageView<T>(List<T> items, int page, int size, long totalItems, int totalPages) {

    public static <E, T> PageView<T> of(Page<E> page, Function<E, T> view) {
        return new PageView<>(page.getContent().stream().map(view).toList(), page.getNumber(), page.getSize(),
                page.getTotalElements(), page.getTotalPages());
    }
}
