package org.specimenledger.customers;

import io.swagger.v3.oas.annotations.Operation;
import jakarta.validation.Valid;
import java.util.List;
import java.util.UUID;
import org.specimenledger.shared.Access;
import org.springframework.http.HttpStatus;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

/** Customers and their orders. The manager writes; customers read only their own organisation. */
@RestController
@RequestMapping("/api/v1")
class CustomerController {

    private final CustomerService service;

    CustomerController(CustomerService service) {
        this.service = service;
    }

    @PostMapping("/customers")
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Register a customer organisation")
    CustomerView register(@Valid @RequestBody CustomerRequests.CustomerRequest request) {
        return service.register(request);
    }

    @GetMapping("/customers")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "List customers (a customer sees only their own organisation)")
    List<CustomerView> list() {
        return service.list();
    }

    @GetMapping("/customers/{id}")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    CustomerView get(@PathVariable UUID id) {
        return service.get(id);
    }

    @PutMapping("/customers/{id}")
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Change a customer's name or address (reason required)")
    CustomerView change(@PathVariable UUID id, @Valid @RequestBody CustomerRequests.CustomerRequest request) {
        return service.change(id, request);
    }

    @PostMapping("/customers/{id}/orders")
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Register an order with its requirements")
    OrderView placeOrder(@PathVariable UUID id, @Valid @RequestBody CustomerRequests.OrderRequest request) {
        return service.placeOrder(id, request);
    }

    @GetMapping("/orders")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "List orders, optionally of one customer")
    List<OrderView> orders(@RequestParam(required = false) UUID customerId) {
        return service.orders(customerId);
    }

    @GetMapping("/orders/{id}")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    OrderView order(@PathVariable UUID id) {
        return service.order(id);
    }

    @PutMapping("/orders/{id}")
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Revise an order's reference, specification or requirements (reason required)")
    OrderView reviseOrder(@PathVariable UUID id, @Valid @RequestBody CustomerRequests.OrderRequest request) {
        return service.reviseOrder(id, request);
    }
}
