package dev.contour.cli;

public final class Main {
    public static void main(String[] args) {
        System.out.println("contour 0.1.0");
    }
}
